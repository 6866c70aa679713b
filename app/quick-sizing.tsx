import { Stack } from 'expo-router';

import { ShellWhenSignedIn } from '../src/components/nav';
import { QuickSizingScreen } from '../src/components/quick-sizing';

/**
 * Quick sizing: open to everyone, signed in or not (it sits outside the signed-in group); members
 * get the app's navigation around it.
 */
export default function QuickSizingRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Quick sizing · Lagline' }} />
      <ShellWhenSignedIn>
        <QuickSizingScreen />
      </ShellWhenSignedIn>
    </>
  );
}
