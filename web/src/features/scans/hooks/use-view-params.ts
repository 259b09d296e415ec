import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * The query string as view settings: views keep their choices in the address, so a reload, a
 * shared link or a trip to a point page and back shows the same picture. `update` applies
 * several changes in one navigation (null removes a setting) and replaces the history entry,
 * so Back leaves the page rather than undoing each choice.
 */
export function useViewParams(): [URLSearchParams, (changes: Record<string, string | null>) => void] {
  const [params, setParams] = useSearchParams();
  const update = useCallback(
    (changes: Record<string, string | null>) =>
      setParams(
        (current) => {
          const copy = new URLSearchParams(current);
          for (const [name, value] of Object.entries(changes)) {
            if (value === null || value === '') copy.delete(name);
            else copy.set(name, value);
          }
          return copy;
        },
        { replace: true },
      ),
    [setParams],
  );
  return [params, update];
}
