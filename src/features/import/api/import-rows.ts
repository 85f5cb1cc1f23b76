import { useQueryClient } from '@tanstack/react-query';
import type { ImportKind, NormalisedRow, RowError } from '@shared/import/csv-import';
import { i18n } from '@/i18n';
import { ApiRequestError, getCsrfToken } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';

export interface ImportResult {
  received: number;
  inserted: number;
  alreadyImported: number;
}

/**
 * Sends the parsed rows with XMLHttpRequest so the upload can report progress. The server
 * writes every row or none; its row errors come back in `details.rows`.
 */
export function sendImport(trialId: string, kind: ImportKind, rows: NormalisedRow[], fileName: string, onProgress: (fraction: number) => void): Promise<ImportResult> {
  const t = i18n.getFixedT(null, 'import');
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/trials/${trialId}/import`);
    xhr.setRequestHeader('Content-Type', 'application/json');
    xhr.setRequestHeader('Accept', 'application/json');
    const token = getCsrfToken();
    if (token) xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(new ApiRequestError(0, 'network_error', t(($) => $.connectionDropped)));
    xhr.onload = () => {
      let body: { data?: ImportResult; error?: { code: string; message: string; details?: unknown; reason?: string; params?: Record<string, string | number> } } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300 && body.data) resolve(body.data);
      else
        reject(
          new ApiRequestError(xhr.status, body.error?.code ?? 'http_error', body.error?.message ?? t(($) => $.failedStatus, { status: xhr.status }), body.error?.details, {
            reason: body.error?.reason,
            params: body.error?.params,
          }),
        );
    };
    xhr.send(JSON.stringify({ kind, fileName, rows }));
  });
}

export function serverRowErrors(err: unknown): { total: number; rows: RowError[] } | null {
  if (err instanceof ApiRequestError && err.details && typeof err.details === 'object' && 'rows' in (err.details as object)) {
    return err.details as { total: number; rows: RowError[] };
  }
  return null;
}

/** After an import, every view of the trial's data is stale. */
export function useAfterImport(trialId: string) {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: queryRoots.logs(trialId) }),
      qc.invalidateQueries({ queryKey: queryRoots.trialAnalysis(trialId) }),
      qc.invalidateQueries({ queryKey: queryRoots.round(trialId) }),
    ]);
}
