// What a failed request or action says to the person: the server's message, the error's, or a plain fallback.
import { ApiRequestError } from '../hooks/api';

export const errorText = (e: unknown) => (e instanceof ApiRequestError ? e.message : e instanceof Error ? e.message : 'Something went wrong.');
