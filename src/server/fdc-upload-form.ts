/**
 * The multipart body of an FDC upload, streamed: busboy parses `request.body` as it arrives and each
 * file goes straight to disk, in a fresh folder under UPLOAD_DIR (upload-files.ts), so no file is
 * ever held in memory whatever its size. Checked on the way: multipart only (415), the files
 * together at most UPLOAD_MAX_BYTES (413 as soon as the count passes it, also without a
 * Content-Length), each file named as FDC names it (food.csv…) and CSV text, not a workbook or the
 * zip itself (415), each once (422); then the dataset's description with the shared zod schema
 * (400) and the files FDC needs (422). Any refusal or a broken connection removes the folder.
 */
import { createWriteStream } from 'node:fs';
import { join } from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import busboy from 'busboy';
import { FDC_OPTIONAL_FILES, FDC_REQUIRED_FILES, type FdcFile } from '@/lib/fdc-csv';
import { UPLOAD_MAX_BYTES, uploadMeta, type UploadMeta } from '@/lib/dataset-upload';
import type { UploadedFile } from './fdc-upload';
import { HttpError } from './http';
import { newIncomingFolder, removeFolder } from './upload-files';

const KNOWN: readonly string[] = [...FDC_REQUIRED_FILES, ...FDC_OPTIONAL_FILES];
/** The form's text fields and part headers beside the files. */
const FORM_OVERHEAD = 64 * 1024;
const FIELDS = ['slug', 'name', 'release', 'publisher', 'licence'] as const;

/** An upload that has arrived whole, in its incoming folder. */
export interface ArrivedUpload {
  meta: UploadMeta;
  files: Map<FdcFile, UploadedFile>;
  folder: string;
}

const tooLarge = () => new HttpError(413, 'too_large', `The files together are larger than ${UPLOAD_MAX_BYTES / 1024 / 1024} MB.`, { files: 'Too large' });

/** True when the first bytes look like a zip or an old Office file rather than text. */
function looksBinary(head: Buffer): boolean {
  const zip = head[0] === 0x50 && head[1] === 0x4b;
  const ole = head[0] === 0xd0 && head[1] === 0xcf;
  return zip || ole || head.subarray(0, 8).includes(0);
}

/** Passes a file through, failing on the first bytes of a binary file and when the upload's total passes the limit. */
function checkedBytes(name: string, total: { bytes: number }, counted: { bytes: number }): Transform {
  let checked = false;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      if (!checked && chunk.length > 0) {
        checked = true;
        if (looksBinary(chunk)) return done(new HttpError(415, 'not_csv', `${name} is not CSV text (a zip or workbook?): unpack the FDC download and upload its CSV files.`, { files: name }));
      }
      total.bytes += chunk.length;
      counted.bytes += chunk.length;
      if (total.bytes > UPLOAD_MAX_BYTES) return done(tooLarge());
      done(null, chunk);
    },
  });
}

/** Reads the whole body into `folder`: the text fields, and each file written as it streams in. */
function receive(request: Request, contentType: string, folder: string): Promise<{ fields: Map<string, string>; files: Map<FdcFile, UploadedFile> }> {
  return new Promise((resolve, reject) => {
    const fields = new Map<string, string>();
    const files = new Map<FdcFile, UploadedFile>();
    const writes: Promise<void>[] = [];
    const total = { bytes: 0 };
    const body = Readable.fromWeb(request.body! as never);
    let failed = false;
    // On a refusal the rest of the body is read and dropped, never cancelled: cancelling the body of
    // Node's Request while a read is pending throws inside undici ("ReadableStream is already
    // closed") and stops the server. The answer goes out at once; the client's bytes go nowhere.
    const fail = (e: unknown) => {
      if (failed) return;
      failed = true;
      body.unpipe(parser);
      parser.destroy();
      body.resume();
      reject(e);
    };
    const parser = busboy({
      headers: { 'content-type': contentType },
      limits: { fileSize: UPLOAD_MAX_BYTES + 1, files: KNOWN.length, fields: 20, fieldSize: 4096, parts: 40 },
    });
    parser.on('field', (name, value) => fields.set(name, value));
    parser.on('file', (field, stream, info) => {
      // A refusal destroys the parser, and with it this file's stream, with an error: it must have a listener.
      stream.on('error', () => {});
      const name = (info.filename ?? '').split(/[\\/]/).pop()!.toLowerCase();
      if (field !== 'files' || failed) return void stream.resume();
      const refused = !KNOWN.includes(name)
        ? new HttpError(415, 'unknown_file', `${info.filename} is not one of the FDC files Selfsown reads: ${KNOWN.join(', ')}.`, { files: info.filename })
        : files.has(name as FdcFile)
          ? new HttpError(422, 'duplicate_file', `${name} is in the upload twice.`, { files: name })
          : null;
      if (refused) {
        stream.resume();
        return fail(refused);
      }
      const upload: UploadedFile = { path: join(folder, name), bytes: 0 };
      files.set(name as FdcFile, upload);
      writes.push(pipeline(stream, checkedBytes(name, total, upload), createWriteStream(upload.path)).catch((e: unknown) => fail(e)));
    });
    parser.on('filesLimit', () => fail(new HttpError(422, 'too_many_files', `Send at most ${KNOWN.length} files: ${KNOWN.join(', ')}.`, { files: 'Too many files' })));
    parser.on('error', () => fail(new HttpError(400, 'invalid_form', 'The multipart body could not be read.')));
    parser.on('close', () => {
      void Promise.all(writes).then(() => {
        if (!failed) resolve({ fields, files });
      });
    });
    // A connection that breaks while the body streams in ends here too.
    body.on('error', () => fail(new HttpError(400, 'upload_interrupted', 'The upload stopped before all of it arrived; send it again.')));
    body.pipe(parser);
  });
}

/**
 * Receives an FDC upload into a new folder under UPLOAD_DIR and checks it; the caller moves the folder
 * to the job (or removes it). Every refusal answers in the documented error shape and leaves no file.
 */
export async function receiveUploadForm(request: Request): Promise<ArrivedUpload> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > UPLOAD_MAX_BYTES + FORM_OVERHEAD) throw tooLarge();
  const contentType = request.headers.get('content-type') ?? '';
  if (!contentType.toLowerCase().startsWith('multipart/form-data') || !request.body) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the CSV files as multipart/form-data.');
  }
  const folder = await newIncomingFolder();
  try {
    const { fields, files } = await receive(request, contentType, folder);
    const meta = uploadMeta.parse(Object.fromEntries(FIELDS.map((k) => [k, fields.get(k) ?? ''])));
    const missing = FDC_REQUIRED_FILES.filter((f) => !files.has(f));
    if (missing.length) throw new HttpError(422, 'missing_files', `The upload needs ${missing.join(', ')} (and may add ${FDC_OPTIONAL_FILES.join(', ')}).`, { files: `Missing: ${missing.join(', ')}` });
    return { meta, files, folder };
  } catch (e) {
    await removeFolder(folder);
    throw e;
  }
}
