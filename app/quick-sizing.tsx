import { Stack } from 'expo-router';

import { QuickSizingScreen } from '../src/components/quick-sizing';

/** Quick sizing: open to everyone, signed in or not (it sits outside the signed-in group). */
export default function QuickSizingRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Quick sizing · Lagline' }} />
      <QuickSizingScreen />
    </>
  );
}
