// The testing library's matchers (toBeInTheDocument, toBeDisabled, …) on vitest's `expect`, for the type checker
// (components.setup.ts adds them at run time).
/// <reference types="@testing-library/jest-dom/vitest" />
