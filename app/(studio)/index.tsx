import { HomeOverview } from '../../components/home/HomeOverview';

export default function HomeScreen() {
  return <HomeOverview />;
}
