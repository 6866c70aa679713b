import { useLocalSearchParams } from 'expo-router';

import { NewEntryScreen } from '../../../src/components/register';

const text = (v: string | string[] | undefined) => (typeof v === 'string' ? v : undefined);

export default function NewRegisterEntryRoute() {
  const p = useLocalSearchParams<{ siteId?: string; itemId?: string; location?: string; method?: string; material?: string }>();
  return <NewEntryScreen start={{ siteId: text(p.siteId), itemId: text(p.itemId), location: text(p.location), method: text(p.method), material: text(p.material) }} />;
}
