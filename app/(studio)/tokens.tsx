import { Screen } from '../../components/layout/Screen';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { EmptyState } from '../../components/ui/EmptyState';
import { TokensPage } from '../../components/tokens/TokensPage';
import { useMe } from '../../hooks/useSession';
import { useCan } from '../../hooks/useCan';
import { useCreateToken, useRevokeToken, useTokens } from '../../hooks/useTokens';

export default function TokensScreen() {
  const me = useMe();
  const mayManage = useCan('tokens.manage');
  const tokens = useTokens(mayManage);
  const create = useCreateToken();
  const revoke = useRevokeToken();
  return (
    <Screen title="API tokens" lede="Read-only tokens for build scripts: fetch leg profiles and check builds for stumble regressions.">
      {me.isPending ? <LoadingPage /> : null}
      {me.data && !mayManage ? (
        <EmptyState heading="Tokens are for owners and programmers" body="Ask your studio's owner or a programmer for a token, or for the profile file itself." />
      ) : null}
      {me.data && mayManage ? <TokensPage tokens={tokens} create={create} revoke={revoke} /> : null}
    </Screen>
  );
}
