import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage, type ApiResult } from '../../api/client';
import { spacing } from '../../theme';
import { Banner, Button, Text } from '../ui';

export interface ConfirmDeleteProps {
  /** The first button ("Delete line"). */
  label: string;
  /** The question asked before anything goes ("Delete 2"-HS-101?"). */
  question: string;
  /** What goes with it. */
  consequence: string;
  keepLabel: string;
  busy: boolean;
  remove: () => Promise<ApiResult<unknown>>;
  onDeleted?: () => void;
  testID?: string;
}

/** Delete in two steps: the first press only asks; the server's refusal (an item still in use) is shown. */
export function ConfirmDelete({ label, question, consequence, keepLabel, busy, remove, onDeleted, testID }: ConfirmDeleteProps) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!confirming) return <Button label={label} variant="danger" onPress={() => setConfirming(true)} testID={testID} />;
  return (
    <Banner tone="caution" title={question} testID={testID ? `${testID}-confirm` : undefined}>
      <Text>{consequence}</Text>
      {error ? <Text tone="fail">{error}</Text> : null}
      <View style={styles.actions}>
        <Button
          label="Delete for good"
          variant="danger"
          busy={busy}
          onPress={async () => {
            setError(null);
            const r = await remove();
            if (r.kind === 'ok') onDeleted?.();
            else setError(problemMessage(r));
          }}
          testID={testID ? `${testID}-yes` : undefined}
        />
        <Button label={keepLabel} variant="secondary" onPress={() => setConfirming(false)} />
      </View>
    </Banner>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
