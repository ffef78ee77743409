import { Screen } from '../../components/layout/Screen';
import { EmptyState } from '../../components/ui/EmptyState';

export default function TeamScreen() {
  return (
    <Screen title="Team" lede="Members, roles, invites and API tokens.">
      <EmptyState heading="Just you so far" body="Invite designers, programmers and art leads by e-mail; each role sees and does what its work needs." />
    </Screen>
  );
}
