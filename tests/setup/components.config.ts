// Placeholder until the React Native component harness lands (tests/setup/).
import type { TestProjectInlineConfiguration } from 'vitest/config';

export const componentsProject: TestProjectInlineConfiguration = {
  test: { name: 'components', include: ['tests/components/**/*.test.tsx'], environment: 'node' },
};
