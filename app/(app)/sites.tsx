import { SitesScreen } from '../../src/components/sites';

export default function SitesRoute() {
  return <SitesScreen />;
}
