import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Logger } from '@nestjs/common';
import { stringify } from 'csv-stringify';
import type { Response } from 'express';
import type { CsvExport } from './exports.service';

const logger = new Logger('CsvExport');

/**
 * Streams a CSV export into the response: database cursor → csv-stringify → socket, with
 * back-pressure all the way (pipeline), so the process holds a chunk at a time. The first row is
 * read before any header is sent, so a database that is down still gets its 503 in words rather
 * than a cut-off file; a failure later can only cut the file short, which the client sees as an
 * aborted download (never a file that looks complete).
 */
export async function sendCsv(res: Response, file: CsvExport): Promise<void> {
  const iterator = file.rows[Symbol.asyncIterator]();
  const first = await iterator.next();
  async function* rows() {
    if (!first.done) yield first.value;
    for (let next = await iterator.next(); !next.done; next = await iterator.next()) yield next.value;
  }
  res.status(200);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  // RFC 4180: CRLF between records, a header row first. The UTF-8 byte order mark tells spreadsheet
  // programs the file is UTF-8, so "Łukasz" and "Ñandú" open as written (common practice).
  const csv = stringify({ header: true, columns: [...file.columns], bom: true, record_delimiter: 'windows' });
  try {
    await pipeline(Readable.from(rows()), csv, res);
  } catch (error) {
    // Headers are gone: all that is left is to end the connection, which pipeline has done.
    logger.error(`The ${file.fileName} export stopped part way: ${(error as Error).message}`);
    await iterator.return?.();
  }
}
