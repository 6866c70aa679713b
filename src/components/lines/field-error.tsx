import { Text } from '../ui';

/** An error under a field that is not a text input (a choice, a list): said, announced, never colour alone. */
export function FieldError({ text, testID }: { text: string | null | undefined; testID?: string }) {
  if (!text) return null;
  return (
    <Text variant="caption" weight="semibold" tone="fail" role="alert" testID={testID}>
      {`Error: ${text}`}
    </Text>
  );
}
