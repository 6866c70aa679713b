import { useLocalSearchParams } from 'expo-router';

import { NewItemScreen } from '../../../../../src/components/lines';

export default function NewLineRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <NewItemScreen siteId={typeof id === 'string' ? id : ''} kind="line" />;
}
