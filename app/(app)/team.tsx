import { TeamScreen } from '../../src/components/team';

export default function TeamRoute() {
  return <TeamScreen />;
}
