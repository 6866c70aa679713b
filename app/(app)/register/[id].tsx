import { useLocalSearchParams } from 'expo-router';

import { EntryScreen } from '../../../src/components/register';

export default function RegisterEntryRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <EntryScreen id={typeof id === 'string' ? id : ''} />;
}
