import type { Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { ApiProblemError } from '../../api/client';
import { useDevMail } from '../../api/team';
import { colors, radius, spacing } from '../../theme';
import { formatDateTime } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { Button, Card, Text, TextLink } from '../ui';

import { splitMailLinks } from './mail-links';

/** The mail's text with this app's own links clickable (same tab); every other address stays text. */
function MailBody({ text }: { text: string }) {
  const origin = typeof window !== 'undefined' && window.location ? window.location.origin : '';
  return (
    <Text variant="caption" selectable>
      {splitMailLinks(text, origin).map((part, i) =>
        part.kind === 'link' ? (
          <TextLink key={i} href={part.href as Href} variant="caption">
            {part.text}
          </TextLink>
        ) : (
          part.text
        ),
      )}
    </Text>
  );
}

/**
 * A development aid: the mail this team's own actions sent (its invitations) as the local mail catcher
 * received it, so they can be followed without a real inbox. Password-reset mail is never shown.
 * Hidden when the server runs without the catcher (the view answers 404) and for roles other than owner.
 */
export function CaughtMailPanel() {
  const mail = useDevMail(true);
  if (mail.isError && mail.error instanceof ApiProblemError && ['not-found', 'forbidden'].includes(mail.error.problem.kind)) return null;
  return (
    <Card
      title="Caught mail"
      subtitle="A development aid: this server runs a local mail catcher instead of sending e-mail. Shown here is the mail your team's own actions sent, such as invitations; password-reset mail is never shown."
      testID="caught-mail"
    >
      <Button label="Refresh" variant="secondary" onPress={() => void mail.refetch()} busy={mail.isFetching} />
      {mail.isPending ? (
        <Loading label="Loading caught mail…" />
      ) : mail.isError ? (
        <QueryError error={mail.error} onRetry={() => void mail.refetch()} title="Could not load caught mail" />
      ) : mail.data.messages.length === 0 ? (
        <Text tone="textMuted">Nothing caught yet. Invitations your team sends will appear here.</Text>
      ) : (
        <View role="list" style={styles.list}>
          {mail.data.messages.map((m) => (
            <View key={String(m.id)} role="listitem" style={styles.message}>
              <Text weight="semibold">{m.subject}</Text>
              <Text variant="caption" tone="textMuted">{`To ${m.to} · ${formatDateTime(m.receivedAt)}`}</Text>
              <MailBody text={m.text} />
            </View>
          ))}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  message: { gap: spacing.xxs, padding: spacing.md, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
});
