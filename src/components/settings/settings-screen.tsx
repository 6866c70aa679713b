import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useSession, useSignOut } from '../../api/session';
import { useUpdateSettings } from '../../api/settings';
import { roleLabels, type UnitSystem } from '../../api/types';
import { spacing } from '../../theme';
import { Banner, Button, Card, ChoiceGroup, Screen, Text } from '../ui';

const unitChoices = [
  { value: 'SI' as const, label: 'SI', description: '°C, mm, m, W/m, kW, m/s' },
  { value: 'US' as const, label: 'US customary', description: '°F, inches, ft, Btu/(h·ft), mph' },
];

export function SettingsScreen({ bottomInset = 0 }: { bottomInset?: number }) {
  const router = useRouter();
  const session = useSession();
  const update = useUpdateSettings();
  const signOut = useSignOut();
  const [message, setMessage] = useState<{ tone: 'pass' | 'fail'; text: string } | null>(null);

  const current = session.data?.settings?.unitSystem ?? 'SI';
  const user = session.data?.user;

  const choose = async (unitSystem: UnitSystem) => {
    setMessage(null);
    if (unitSystem === current) return;
    const result = await update.mutateAsync({ unitSystem });
    setMessage(
      result.kind === 'ok'
        ? { tone: 'pass', text: `Units saved: ${unitChoices.find((c) => c.value === unitSystem)?.label ?? unitSystem}. Results and inputs use them from now on.` }
        : { tone: 'fail', text: problemMessage(result) },
    );
  };

  return (
    <Screen width="medium" title="Settings" intro="Your own preferences; they follow you to any device." bottomInset={bottomInset}>
      <Card title="Units" subtitle="How Lagline shows and asks for quantities. Calculations always run in SI.">
        <ChoiceGroup label="Unit system" value={current} choices={unitChoices} onChange={(v) => void choose(v)} disabled={update.isPending} testID="unit-system" />
        {message ? (
          <Banner tone={message.tone} testID="units-message">
            {message.text}
          </Banner>
        ) : null}
      </Card>
      <Card title="Account">
        {user ? (
          <View style={styles.account}>
            <Text weight="semibold">{user.name}</Text>
            <Text tone="textMuted">{user.email}</Text>
            {session.data?.team ? (
              <Text tone="textMuted">{`${roleLabels[session.data.role ?? 'viewer']} in ${session.data.team.name}`}</Text>
            ) : null}
          </View>
        ) : null}
        <Button
          label="Sign out"
          icon="signout"
          variant="secondary"
          busy={signOut.isPending}
          testID="sign-out"
          onPress={async () => {
            await signOut.mutateAsync();
            router.replace('/');
          }}
        />
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  account: { gap: spacing.xxs },
});
