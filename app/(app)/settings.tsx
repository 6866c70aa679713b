import { SettingsScreen } from '../../src/components/settings';

export default function SettingsRoute() {
  return <SettingsScreen />;
}
