// The forms' schemas and their resolver, as one lazily loaded chunk (hooks/lazyResolver.ts): the signed-out
// pages' and the library's dialogs' (a new setup, a copy).
export { zodResolver } from '@hookform/resolvers/zod';
export { duplicateForm, forgotPasswordBody, newSetupForm, resetPasswordBody, signInBody, signUpBody } from '../model/forms';
