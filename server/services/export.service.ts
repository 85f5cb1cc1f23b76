import type { Response } from 'express';
import Papa from 'papaparse';
import type { PoolClient } from 'pg';
import { to as copyTo } from 'pg-copy-streams';
import { pipeline } from 'node:stream/promises';
import type { Translate } from '@shared/i18n/translate';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { dictionaryRows, exportSelect, findExportTable, type ExportScope } from './export-tables';

/** UTF-8 byte order mark: spreadsheet programs then read accented names correctly. */
const BOM = '\uFEFF';

export function exportService(ctx: AppContext) {
  /** Runs fn with a dedicated pooled connection (COPY needs the raw client). */
  async function withClient<T>(fn: (client: PoolClient) => Promise<T>): Promise<T> {
    const runner = ctx.ds.createQueryRunner();
    // PostgresQueryRunner.connect() resolves with its pooled pg client.
    const client = (await runner.connect()) as PoolClient;
    try {
      return await fn(client);
    } finally {
      await runner.release();
    }
  }

  return {
    /**
     * Streams one table as CSV straight from PostgreSQL's COPY to the response: memory stays flat
     * whatever the size. Text cells are neutralised against spreadsheet formulas in the SELECT.
     */
    async streamTable(res: Response, scope: ExportScope, tableName: string, fileName: string): Promise<void> {
      const table = findExportTable(tableName);
      if (!table) throw AppError.notFound('Export table');
      await withClient(async (client) => {
        const sql = exportSelect(table, scope, (v) => client.escapeLiteral(v));
        res.status(200);
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
        res.setHeader('Cache-Control', 'no-store');
        res.write(BOM);
        const stream = client.query(copyTo(`COPY (${sql}) TO STDOUT WITH (FORMAT csv, HEADER true)`));
        // Eleven 'close' listeners on one response, a fixed number (not one per chunk): the three
        // compressors (server/http/compression.ts) and the request log before, then pipeline()'s
        // own. Node warns about a leak past ten, so the limit is raised for this response only.
        res.setMaxListeners(Math.max(res.getMaxListeners(), 16));
        await pipeline(stream, res);
      });
    },

    /** The data dictionary in the reader's language (column names stay the same in every language). */
    dictionaryCsv(scope: ExportScope, t: Translate): string {
      return BOM + Papa.unparse(dictionaryRows(scope, t), { newline: '\r\n', escapeFormulae: true });
    },
  };
}
