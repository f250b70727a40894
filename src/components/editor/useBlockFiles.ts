/**
 * The attached files the editor preview's blocks read: the server's list at page load, then
 * reloaded (`GET /api/v1/cases/:id/block-files`) whenever the Files panel changes them.
 */
import { useEffect, useState } from 'react';
import type { BlockFiles } from '../../lib/calc/files';
import { ATTACHMENTS_CHANGED } from '../attachments/events';

export function useBlockFiles(caseId: string, initial: BlockFiles): BlockFiles {
  const [files, setFiles] = useState(initial);
  useEffect(() => {
    let latest = 0;
    const reload = async (event: Event) => {
      if ((event as CustomEvent<{ caseId?: string }>).detail?.caseId !== caseId) return;
      const asked = ++latest;
      try {
        const response = await fetch(`/api/v1/cases/${caseId}/block-files`, { headers: { accept: 'application/json' } });
        if (!response.ok) return; // The preview keeps the files it had; the Files panel shows what failed.
        const body = (await response.json()) as BlockFiles;
        if (asked === latest) setFiles({ names: body.names, texts: body.texts, ...(body.unreadable ? { unreadable: body.unreadable } : {}) });
      } catch {
        // Offline: keep the files the preview had.
      }
    };
    window.addEventListener(ATTACHMENTS_CHANGED, reload);
    return () => window.removeEventListener(ATTACHMENTS_CHANGED, reload);
  }, [caseId]);
  return files;
}
