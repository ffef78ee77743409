import { useMe } from './useSession';

/** Whether the viewer's role may take an action of the server's permission table. */
export function useCan(action: string): boolean {
  const me = useMe();
  return !!me.data?.permissions.includes(action);
}
