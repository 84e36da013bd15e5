/**
 * The multipart body of an FDC upload: size-limited by Content-Length before it is read (413),
 * multipart only (415), the dataset's description parsed with the shared zod schema, and each file
 * named as FDC names it (food.csv…) and plain CSV text, not a workbook or the zip itself (415).
 */
import { FDC_OPTIONAL_FILES, FDC_REQUIRED_FILES, type FdcFile } from '@/lib/fdc-csv';
import { UPLOAD_MAX_BYTES, uploadMeta, type UploadMeta } from '@/lib/dataset-upload';
import { HttpError } from './http';

const KNOWN: readonly string[] = [...FDC_REQUIRED_FILES, ...FDC_OPTIONAL_FILES];
const FORM_OVERHEAD = 64 * 1024;

/** True when the first bytes look like a zip or an old Office file rather than text. */
async function looksBinary(file: Blob): Promise<boolean> {
  const head = new Uint8Array(await file.slice(0, 8).arrayBuffer());
  const zip = head[0] === 0x50 && head[1] === 0x4b;
  const ole = head[0] === 0xd0 && head[1] === 0xcf;
  return zip || ole || head.includes(0);
}

export async function readUploadForm(request: Request): Promise<{ meta: UploadMeta; files: Map<FdcFile, Blob> }> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (!Number.isFinite(declared)) throw new HttpError(411, 'length_required', 'Send the upload with its Content-Length.');
  if (declared > UPLOAD_MAX_BYTES + FORM_OVERHEAD) throw new HttpError(413, 'too_large', `The files together are larger than ${UPLOAD_MAX_BYTES / 1024 / 1024} MB.`);
  if (!(request.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/form-data')) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the CSV files as multipart/form-data.');
  }
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw new HttpError(400, 'invalid_form', 'The multipart body could not be read.');
  }
  const meta = uploadMeta.parse(Object.fromEntries(['slug', 'name', 'release', 'publisher', 'licence'].map((k) => [k, form.get(k) ?? ''])));
  const files = new Map<FdcFile, Blob>();
  for (const entry of form.getAll('files')) {
    if (typeof entry === 'string') continue;
    const name = entry.name.split(/[\\/]/).pop()!.toLowerCase();
    if (!KNOWN.includes(name)) throw new HttpError(415, 'unknown_file', `${entry.name} is not one of the FDC files Selfsown reads: ${KNOWN.join(', ')}.`, { files: entry.name });
    if (files.has(name as FdcFile)) throw new HttpError(422, 'duplicate_file', `${name} is in the upload twice.`, { files: name });
    if (await looksBinary(entry)) throw new HttpError(415, 'not_csv', `${name} is not CSV text (a zip or workbook?): unpack the FDC download and upload its CSV files.`, { files: name });
    files.set(name as FdcFile, entry);
  }
  const missing = FDC_REQUIRED_FILES.filter((f) => !files.has(f));
  if (missing.length) throw new HttpError(422, 'missing_files', `The upload needs ${missing.join(', ')} (and may add ${FDC_OPTIONAL_FILES.join(', ')}).`, { files: `Missing: ${missing.join(', ')}` });
  return { meta, files };
}
