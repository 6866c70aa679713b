import { useRouter } from 'expo-router';
import { useMemo } from 'react';

import { can } from '../../../shared/schemas/permissions';
import { useLibrary } from '../../api/library';
import { useCreateItem, useSizingSettings } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import type { BuildUp, ItemKind, LibraryPayload } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { Loading } from '../common/query-state';
import { finishOptions, libraryName, materialOptions } from '../library/library-options';
import { SiteSectionTabs } from '../sites/site-section-nav';
import { PageTitle, Screen, Text } from '../ui';

import { ItemForm } from './item-form';
import { itemHref } from './item-rows';
import { KIND_WORDS } from './labels';

/** A build-up in words: "Mineral fibre … under Aluminium jacket …". */
export function buildUpWords(b: BuildUp | null | undefined, lib: LibraryPayload | undefined): string {
  if (!b) return 'the site’s default';
  const layers = b.layers.map((l) => libraryName(lib, l.materialId)).join(' + ');
  return `${layers || 'bare'} under ${libraryName(lib, b.finishId)}${b.fixed ? ' (as built)' : ''}`;
}

/** The site's defaults in one sentence, for the build-up choice. */
export function siteDefaultNote(defaults: { hot: BuildUp; cold: BuildUp } | undefined, lib: LibraryPayload | undefined): string | undefined {
  if (!defaults) return undefined;
  return `Hot service: ${buildUpWords(defaults.hot, lib)}. Cold service: ${buildUpWords(defaults.cold, lib)}. The outer layer is sized.`;
}

/** Adds a line or vessel to a site. */
export function NewItemScreen({ siteId, kind }: { siteId: string; kind: ItemKind }) {
  const router = useRouter();
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const site = useSite(siteId);
  const library = useLibrary();
  const settings = useSizingSettings(siteId);
  const create = useCreateItem(siteId, kind);
  const words = KIND_WORDS[kind];
  const materials = useMemo(() => materialOptions(library.data, system), [library.data, system]);
  const finishes = useMemo(() => finishOptions(library.data), [library.data]);
  const back = `/sites/${encodeURIComponent(siteId)}/${kind === 'line' ? 'lines' : 'vessels'}`;

  return (
    <Screen width="medium" testID="new-item-screen">
      <SiteSectionTabs siteId={siteId} siteName={site.data?.name} current={kind === 'line' ? 'lines' : 'vessels'} />
      <PageTitle title={`Add a ${words.one}`} intro={site.data ? `To ${site.data.name}. It is sized with the rest of the site.` : undefined} />
      {!can(session.data?.role, 'lines.edit') ? (
        <Text tone="textMuted">An owner or engineer adds {words.many}; your role reads them.</Text>
      ) : library.isPending ? (
        <Loading label="Loading the library…" />
      ) : (
        <ItemForm
          kind={kind}
          system={system}
          materials={materials}
          finishes={finishes}
          siteDefaultNote={siteDefaultNote(settings.data?.defaultBuildUps, library.data)}
          submit={(input) => create.mutateAsync(input)}
          onDone={(item) => router.replace(itemHref(kind, item.id))}
          onCancel={() => router.replace(back)}
        />
      )}
    </Screen>
  );
}
