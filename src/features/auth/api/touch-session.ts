import type { SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';

/** Keep-alive: tells the server the person is still at the tablet. */
export async function touchSession(): Promise<SessionInfo> {
  return rememberSession(await apiPost<SessionInfo>('/auth/touch'));
}
