/**
 * Reading an upload from a multipart/form-data request: a size guard before the body is read, a
 * clear answer when the body did not arrive whole, and the file's bytes with its other fields.
 */
import { HttpError } from '@/lib/api/errors';
import { inspectUpload, UploadRefused, type InspectedUpload, type UploadKind } from './inspect';

export interface MultipartUpload {
  file: { bytes: Uint8Array; name: string } | null;
  fields: Record<string, string>;
}

/** Room for the form's boundaries and small fields on top of the file itself. */
const OVERHEAD = 256 * 1024;

export async function readMultipart(req: Request, fileField: string, maxFileBytes: number): Promise<MultipartUpload> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data/i.test(type)) throw new HttpError(415, 'Send the upload as multipart/form-data.');
  const length = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(length) && length > maxFileBytes + OVERHEAD) {
    throw new HttpError(413, `The upload is too large: at most ${(maxFileBytes / 1024 / 1024).toFixed(0)} MB.`);
  }
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new HttpError(400, 'The upload did not arrive whole. Nothing was saved; try again.');
  }
  const fields: Record<string, string> = {};
  let file: MultipartUpload['file'] = null;
  for (const [key, value] of form.entries()) {
    if (typeof value === 'string') fields[key] = value;
    else if (key === fileField && !file) {
      if (value.size > maxFileBytes) throw new HttpError(413, `The file is too large: at most ${(maxFileBytes / 1024 / 1024).toFixed(0)} MB.`);
      file = { bytes: new Uint8Array(await value.arrayBuffer()), name: value.name ?? '' };
    }
  }
  return { file, fields };
}

/** `inspectUpload` with its refusals as HTTP errors (field errors on the file field). */
export function inspectOrRefuse(file: { bytes: Uint8Array; name: string } | null, allowed: readonly UploadKind[], field: string): InspectedUpload {
  if (!file) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { [field]: ['Choose a file to upload'] } });
  try {
    return inspectUpload(file.bytes, allowed, file.name);
  } catch (err) {
    if (err instanceof UploadRefused) throw new HttpError(err.status, err.message, { fieldErrors: { [field]: [err.message] } });
    throw err;
  }
}
