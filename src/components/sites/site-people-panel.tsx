import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useAddSiteMember, useRemoveSiteMember } from '../../api/sites';
import { useTeam } from '../../api/team';
import { roleLabels, type Member, type SiteDetail, type SiteMember } from '../../api/types';
import { spacing } from '../../theme';
import { Loading } from '../common/query-state';
import { Banner, Button, Card, SelectField, Text, personRows, type SelectOption } from '../ui';

/** People who may be added: team members not on the site yet, contractors first (they are the ones it changes). */
export function addableMembers(team: readonly Member[], onSite: readonly SiteMember[]): Member[] {
  const taken = new Set(onSite.map((m) => String(m.userId)));
  return team
    .filter((m) => !taken.has(String(m.userId)))
    .sort((a, b) => Number(b.role === 'contractor') - Number(a.role === 'contractor') || a.name.localeCompare(b.name));
}

function PersonRow({ site, person, role }: { site: SiteDetail; person: SiteMember; role?: Member['role'] }) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const remove = useRemoveSiteMember(site.id);
  return (
    <View role="listitem" style={styles.row} testID={`site-person-${person.email}`}>
      <View style={styles.rowHead}>
        <View style={styles.who}>
          <Text weight="semibold">{person.name}</Text>
          <Text variant="caption" tone="textMuted">
            {`${person.email}${role ? ` · ${roleLabels[role]}` : ''}`}
          </Text>
        </View>
        {!confirming ? (
          <Button label="Remove" variant="quiet" aria-label={`Remove ${person.name} from ${site.name}`} onPress={() => setConfirming(true)} />
        ) : null}
      </View>
      {confirming ? (
        <View style={styles.confirm} role="group" aria-label={`Confirm removing ${person.name} from the site`}>
          <Text>
            {role === 'contractor'
              ? `Take ${person.name} off ${site.name}? As a contractor they stop seeing this site at once.`
              : `Take ${person.name} off ${site.name}? Their role still lets them read every site of the team.`}
          </Text>
          <View style={styles.actions}>
            <Button
              label="Remove from site"
              variant="danger"
              busy={remove.isPending}
              aria-label={`Yes, remove ${person.name} from ${site.name}`}
              onPress={async () => {
                setError(null);
                const result = await remove.mutateAsync(person.userId);
                if (result.kind !== 'ok') {
                  setConfirming(false);
                  setError(problemMessage(result));
                }
              }}
            />
            <Button label="Keep" variant="secondary" aria-label={`Keep ${person.name} on ${site.name}`} onPress={() => setConfirming(false)} />
          </View>
        </View>
      ) : null}
      {error ? (
        <Banner tone="fail" title="Not removed">
          {error}
        </Banner>
      ) : null}
    </View>
  );
}

/**
 * Who is on a site, for owners and engineers: contractors see only the sites they are added to, so this is
 * where a contractor is given a site (and taken off it).
 */
export function SitePeoplePanel({ site }: { site: SiteDetail }) {
  const team = useTeam();
  const add = useAddSiteMember(site.id);
  const [chosen, setChosen] = useState<string>('');
  const [error, setError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const people = site.members ?? [];
  const roleOf = new Map((team.data?.members ?? []).map((m) => [String(m.userId), m.role]));
  const candidates = addableMembers(team.data?.members ?? [], people);
  const options: SelectOption[] = candidates.map((m) => ({ value: String(m.userId), label: `${m.name} — ${roleLabels[m.role]}`, detail: m.email }));
  const pick = options.some((o) => o.value === chosen) ? chosen : (options[0]?.value ?? '');

  return (
    <Card
      title="People on this site"
      subtitle="Contractors see only the sites they are added to; everyone else on the team sees every site."
      testID="site-people"
    >
      {people.length === 0 ? (
        <Text tone="textMuted" testID="site-people-empty">
          No one is added to this site yet. Add a contractor so they can see it and import its schedule.
        </Text>
      ) : (
        <View role="list" style={styles.list}>
          {people.map((p) => (
            <PersonRow key={String(p.userId)} site={site} person={p} role={roleOf.get(String(p.userId))} />
          ))}
        </View>
      )}
      {added ? (
        <Banner tone="pass" title="Added" testID="site-people-added">
          {added}
        </Banner>
      ) : null}
      {error ? (
        <Banner tone="fail" title="Not added">
          {error}
        </Banner>
      ) : null}
      {team.isPending ? (
        <Loading label="Loading the team…" />
      ) : candidates.length === 0 ? (
        <Text variant="caption" tone="textMuted">
          Everyone on the team is on this site. Invite a contractor to the team first (Team → Invite someone).
        </Text>
      ) : (
        <View style={styles.add}>
          <SelectField label="Add a team member to this site" value={pick} options={options} onChange={setChosen} testID="site-people-choose" />
          <Button
            label="Add to site"
            icon="plus"
            variant="secondary"
            busy={add.isPending}
            testID="site-people-add"
            onPress={async () => {
              setError(null);
              setAdded(null);
              const person = candidates.find((m) => String(m.userId) === pick);
              if (!person) return;
              const result = await add.mutateAsync(person.userId);
              if (result.kind === 'ok') setAdded(`${person.name} can now see ${site.name}.`);
              else setError(problemMessage(result));
            }}
          />
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  ...personRows,
  add: { gap: spacing.sm },
});
