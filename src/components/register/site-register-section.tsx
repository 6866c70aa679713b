import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { useRegister } from '../../api/register';
import { useSession } from '../../api/session';
import { spacing } from '../../theme';
import { Button, Card, Text, TextLink } from '../ui';

import { TALL_LINK } from './words';

/** A site's part of the hot-surface register: what needs work, and the way in. */
export function SiteRegisterSection({ siteId }: { siteId: string }) {
  const router = useRouter();
  const session = useSession();
  const list = useRegister({ siteId, status: 'active' }, !!session.data?.user);
  const counts = list.data?.pages[0]?.counts;
  const active = counts ? counts.open + counts.actionAssigned + counts.madeSafe : null;
  return (
    <Card title="Hot-surface register" subtitle="Hot and very cold surfaces found on this site, and lines its sizing leaves above the touch limit" testID="site-register">
      {counts ? (
        <Text testID="site-register-counts">
          {`${active} needing work (${counts.fail} failing) · ${counts.calculated} calculated by sizing · ${counts.overdue} overdue · ${counts.verified + counts.accepted} closed`}
        </Text>
      ) : (
        <Text tone="textMuted">{list.isError ? 'The register could not be loaded.' : 'Loading the register…'}</Text>
      )}
      <View style={styles.row}>
        <TextLink href={`/register?siteId=${encodeURIComponent(siteId)}` as never} testID="site-register-open" style={TALL_LINK}>
          Open the site&apos;s register
        </TextLink>
        {can(session.data?.role, 'surfaces.create') ? (
          <Button label="Record a hot surface" icon="plus" variant="secondary" onPress={() => router.push(`/register/new?siteId=${encodeURIComponent(siteId)}` as never)} testID="site-register-new" />
        ) : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.lg },
});
