import { TeamPage } from '../../components/team/TeamPage';

export default function TeamScreen() {
  return <TeamPage />;
}
