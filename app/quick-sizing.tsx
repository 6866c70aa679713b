import { QuickSizingScreen } from '../src/components/quick-sizing';

/** Quick sizing: open to everyone, signed in or not. */
export default function QuickSizingRoute() {
  return <QuickSizingScreen />;
}
