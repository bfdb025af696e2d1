import { useEffect } from 'react';

/** Sets the document title as "<page> · Gaugeline". */
export function usePageTitle(title: string | undefined): void {
  useEffect(() => {
    document.title = title ? `${title} · Gaugeline` : 'Gaugeline';
  }, [title]);
}
