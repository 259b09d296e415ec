import { useEffect } from 'react';

/** Page titles help people with many tabs and screen-reader users know where they are. */
export function useDocumentTitle(title: string) {
  useEffect(() => {
    document.title = title ? `${title} · Sixtyfold` : 'Sixtyfold';
  }, [title]);
}
