import { randomUUID } from 'node:crypto';
import type { PoolClient } from 'pg';
import { to as copyTo } from 'pg-copy-streams';
import type { DataSource } from 'typeorm';
import { BinaryCopyWriter, copyIn, uuidBytes } from './copy-binary';

/**
 * An uploaded file's bytes go to and from PostgreSQL by binary COPY. A bytea in a query's parameters or
 * results travels as hex text, twice its size, which the client must build or parse as one string: for a
 * 25 MB file that was about half a second of the API's time on each of the upload and the import (profiled
 * with `BENCH_CPU_PROFILE=1 npm run bench -- import`). COPY sends the raw bytes.
 */

/** PostgreSQL's binary COPY header: signature, flags, header extension length (PostgreSQL 15 docs, "COPY"). */
const HEADER_BYTES = 11 + 4 + 4;

export interface NewFile {
  labId: string;
  filename: string;
  format: 'csv' | 'xlsx';
  sizeBytes: number;
  sha256: string;
  content: Buffer;
  uploadedBy: string;
}

async function withClient<T>(dataSource: DataSource, work: (client: PoolClient) => Promise<T>): Promise<T> {
  const runner = dataSource.createQueryRunner();
  try {
    return await work((await runner.connect()) as PoolClient);
  } finally {
    await runner.release();
  }
}

/** Stores a file and returns its new id. */
export async function insertFile(dataSource: DataSource, file: NewFile): Promise<string> {
  const id = randomUUID();
  const writer = new BinaryCopyWriter(512);
  writer.tuple(8);
  writer.uuid(uuidBytes(id));
  writer.uuid(uuidBytes(file.labId));
  writer.text(file.filename);
  writer.text(file.format);
  writer.int4(file.sizeBytes);
  writer.text(file.sha256);
  writer.uuid(uuidBytes(file.uploadedBy));
  // The content is the last field: its bytes go to the server as they are, between the writer's output
  // up to its length word and the stream's trailer, without being copied into the writer.
  writer.bytesLength(file.content.length);
  const stream = writer.finish();
  const trailer = stream.length - 2;
  await withClient(dataSource, (client) =>
    copyIn(
      client,
      'COPY dataset_files (id, lab_id, filename, format, size_bytes, sha256, uploaded_by, content) FROM STDIN (FORMAT binary)',
      [stream.subarray(0, trailer), file.content, stream.subarray(trailer)],
    ),
  );
  return id;
}

/** A file's bytes, or null when the lab has no such file. */
export async function readFileContent(dataSource: DataSource, labId: string, fileId: string): Promise<Buffer | null> {
  // COPY takes no parameters: the ids go in as literals, each checked to be a uuid first.
  const [lab, file] = [labId, fileId].map((id) => uuidBytes(id).toString('hex'));
  const chunks: Buffer[] = [];
  await withClient(dataSource, async (client) => {
    const stream = client.query(
      copyTo(
        `COPY (SELECT content FROM dataset_files WHERE id = '${file}'::uuid AND lab_id = '${lab}'::uuid) TO STDOUT (FORMAT binary)`,
      ),
    );
    for await (const chunk of stream as AsyncIterable<Buffer>) chunks.push(chunk);
  });
  return singleByteaField(Buffer.concat(chunks));
}

/** The one field of the one tuple of a binary COPY stream, or null when the stream holds no tuple. */
function singleByteaField(stream: Buffer): Buffer | null {
  const extension = stream.readInt32BE(HEADER_BYTES - 4);
  let at = HEADER_BYTES + extension;
  const fields = stream.readInt16BE(at);
  if (fields === -1) return null;
  if (fields !== 1) throw new Error(`expected one field per tuple, got ${fields}`);
  const length = stream.readInt32BE(at + 2);
  at += 6;
  return length === -1 ? null : stream.subarray(at, at + length);
}
