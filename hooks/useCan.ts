import { useMe } from './useSession';

/**
 * The client's one permission check: whether the viewer's role may take `action`, an action name of the server's
 * permission table. The server sends the viewer's allowed actions with the session (built from that same table),
 * so the roles are never written down in the client. Screens call it and hand components a `mayX` flag.
 */
export function useCan(action: string): boolean {
  const me = useMe();
  return !!me.data?.permissions.includes(action);
}
