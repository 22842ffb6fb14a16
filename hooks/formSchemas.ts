// The signed-out forms' schemas and their resolver, as one lazily loaded chunk (hooks/lazyResolver.ts).
export { zodResolver } from '@hookform/resolvers/zod';
export { forgotPasswordBody, resetPasswordBody, signInBody, signUpBody } from '../model/forms';
