import { sessionInfoSchema, type SessionInfo, type SignInInput } from '@shared/schemas/session';
import { http } from './http';

/** Who is signed in (user null when nobody). Public. */
export function getSession(): Promise<SessionInfo> {
  return http.get('/session', { schema: sessionInfoSchema });
}

/** Signs in with e-mail and password; the server sets the session cookie and replies with the new session. */
export function signIn(input: SignInInput): Promise<SessionInfo> {
  return http.post('/session', input, { schema: sessionInfoSchema });
}

/** Ends the session server-side and clears its cookie. */
export function signOut(): Promise<void> {
  return http.delete('/session');
}
