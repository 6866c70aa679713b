import { Screen, TextLink, Text } from '../src/components/ui';

export default function NotFoundRoute() {
  return (
    <Screen title="Page not found" width="narrow">
      <Text tone="textMuted">There is nothing at this address. It may have moved, or the link was mistyped.</Text>
      <TextLink href="/">Go to the start page</TextLink>
    </Screen>
  );
}
