/// <reference lib="webworker" />
/**
 * Parses a CSV file off the main thread and reports progress. Decodes UTF-8, falling back to
 * Latin-1 (Windows-1252) when the bytes are not valid UTF-8, and says which it used.
 */
import Papa from 'papaparse';

/** Problems and warnings travel as codes; the wizard words them in the reader's language (`import` namespace). */
export type WorkerError = { code: 'fileEmpty' | 'noHeader' } | { code: 'unreadable'; detail: string };
export type WorkerWarning = 'oneColumn';

export type WorkerMessage =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; headers: string[]; rows: string[][]; encoding: 'utf-8' | 'windows-1252'; delimiter: string; warnings: WorkerWarning[] }
  | { type: 'error'; error: WorkerError };

const post = (m: WorkerMessage) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(m);

self.onmessage = async (ev: MessageEvent<{ file: File }>) => {
  try {
    const bytes = new Uint8Array(await ev.data.file.arrayBuffer());
    let text: string;
    let encoding: 'utf-8' | 'windows-1252' = 'utf-8';
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      text = new TextDecoder('windows-1252').decode(bytes);
      encoding = 'windows-1252';
    }
    text = text.replace(/^\uFEFF/, '');
    if (!text.trim()) {
      post({ type: 'error', error: { code: 'fileEmpty' } });
      return;
    }
    const rows: string[][] = [];
    const warnings: WorkerWarning[] = [];
    let delimiter = ',';
    Papa.parse<string[]>(text, {
      skipEmptyLines: 'greedy',
      chunkSize: 256 * 1024,
      chunk: (results: Papa.ParseResult<string[]>) => {
        delimiter = results.meta.delimiter;
        for (const r of results.data) rows.push(r);
        post({ type: 'progress', fraction: Math.min(1, (results.meta.cursor ?? 0) / text.length) });
      },
      complete: () => {
        const [headers, ...data] = rows;
        if (!headers) {
          post({ type: 'error', error: { code: 'noHeader' } });
          return;
        }
        if (headers.length === 1 && /[;\t|]/.test(text.slice(0, 2000)) === false && /,/.test(headers[0] ?? '') === false) {
          warnings.push('oneColumn');
        }
        post({ type: 'progress', fraction: 1 });
        post({ type: 'done', headers: headers.map((h) => h.trim()), rows: data, encoding, delimiter, warnings });
      },
    });
  } catch (err) {
    post({ type: 'error', error: { code: 'unreadable', detail: (err as Error).message } });
  }
};
