import type { LikelihoodSetEntry } from '@sixtyfold/shared';
import { useLikelihoodSets } from '../api/get-likelihood-sets';
import { useViewParams } from './use-view-params';

/** The entry a reference `key` or `key@version` names: that version, or the newest of the key. */
export function findLikelihoodEntry(sets: readonly LikelihoodSetEntry[], ref: string): LikelihoodSetEntry | undefined {
  const [key, version] = ref.split('@');
  const ofKey = sets.filter((set) => set.key === key);
  if (version !== undefined) return ofKey.find((set) => set.version === Number(version));
  return ofKey.reduce<LikelihoodSetEntry | undefined>((newest, set) => (newest && newest.version >= set.version ? newest : set), undefined);
}

/** The reference of an entry as the address and the API take it. */
export const likelihoodRef = (set: Pick<LikelihoodSetEntry, 'key' | 'version'>) => `${set.key}@${set.version}`;

/**
 * The likelihood sets a view judges and draws by, kept in the address as `likelihood`
 * (comma-separated `key[@version]`), so the constraints, heatmaps and plane of a scan agree and
 * a shared link shows the same regions. `sets` holds the chosen entries once the list is loaded.
 */
export function useChosenLikelihoods(defaults: readonly string[]) {
  const [params, update] = useViewParams();
  const list = useLikelihoodSets();
  const refs = params.get('likelihood')?.split(',').filter(Boolean) ?? [...defaults];
  const sets = list.data ? refs.flatMap((ref) => findLikelihoodEntry(list.data, ref) ?? []) : [];
  const choose = (next: string[]) => update({ likelihood: next.length === defaults.length && next.every((ref, i) => ref === defaults[i]) ? null : next.join(',') });
  return { refs, sets, list, choose };
}

export type ChosenLikelihoods = ReturnType<typeof useChosenLikelihoods>;
