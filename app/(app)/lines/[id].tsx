import { useLocalSearchParams } from 'expo-router';

import { ItemScreen } from '../../../src/components/lines';

export default function LineRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ItemScreen id={typeof id === 'string' ? id : ''} kind="line" />;
}
