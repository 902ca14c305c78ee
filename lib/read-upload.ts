// Reads an uploaded CSV from a request: multipart with a `file` field, or a bare text/csv body.
// Too large is refused from Content-Length before reading, and again while the bytes stream in,
// so an 11 MB body never gets parsed (a missing or lying Content-Length cannot get around it).
import { HttpError } from "@/lib/http";
import { MULTIPART_SLACK_BYTES } from "@/lib/profile/limits";
import { oneLine, unstorableText } from "@/lib/text-field";

export type UploadedText = { fileName: string; text: string; fields: Record<string, string> };

const megabytes = (bytes: number) => `${Number((bytes / 1e6).toPrecision(3))} MB`;

function tooLarge(maxBytes: number, size?: number): HttpError {
  return new HttpError(
    413,
    `The file is larger than ${megabytes(maxBytes)}${size !== undefined ? ` (it is ${megabytes(size)})` : ""}; nothing was stored.`,
  );
}

/**
 * The body's bytes, counted as they arrive whatever the framing (Content-Length or chunked): past
 * `limit` the read stops, the rest of the stream is cancelled (never buffered) and `tooBig` is thrown.
 */
export async function readBodyBytes(request: Request, limit: number, tooBig: () => HttpError): Promise<Uint8Array[]> {
  const declared = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > limit) throw tooBig();
  if (!request.body) return [];
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      throw new HttpError(422, "The request was interrupted before the whole body arrived; nothing was stored.", {
        "(body)": ["upload interrupted"],
      });
    }
    if (step.done) return chunks;
    total += step.value.byteLength;
    if (total > limit) {
      void reader.cancel().catch(() => undefined);
      throw tooBig();
    }
    chunks.push(step.value);
  }
}

/** The body as UTF-8 text, at most `limit` bytes (see readBodyBytes). */
export async function readBodyText(request: Request, limit: number, tooBig: () => HttpError): Promise<string> {
  const chunks = await readBodyBytes(request, limit, tooBig);
  return new TextDecoder().decode(Buffer.concat(chunks));
}

/** The body, counted as it arrives: over `limit` bytes stops the read with 413. */
async function countedBody(request: Request, limit: number, maxBytes: number): Promise<Response> {
  const chunks = await readBodyBytes(request, limit, () => tooLarge(maxBytes));
  return new Response(new Blob(chunks as BlobPart[]), {
    headers: { "content-type": request.headers.get("content-type") ?? "" },
  });
}

/** A file name that can be stored and shown on one line, or a 422 on the upload's field. */
function storableFileName(raw: string, fieldName: string): string {
  const why = unstorableText(raw, false);
  if (why)
    throw new HttpError(422, `The file name ${why}; rename the file and try again.`, {
      [fieldName]: [`file name ${why}`],
    });
  return oneLine(raw).trim().slice(0, 200);
}

export async function readCsvUpload(request: Request, maxBytes: number, fieldName = "file"): Promise<UploadedText> {
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  const multipart = type.startsWith("multipart/form-data");
  const limit = maxBytes + (multipart ? MULTIPART_SLACK_BYTES : 0);
  const declared = Number(request.headers.get("content-length") ?? "");
  // Said here with the declared size; readBodyBytes repeats the check for any other caller.
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(maxBytes, multipart ? undefined : declared);
  const body = await countedBody(request, limit, maxBytes);

  if (multipart) {
    let form: FormData;
    try {
      form = await body.formData();
    } catch {
      throw new HttpError(422, 'The request is not a readable multipart form; send the CSV in the form field "file".', {
        [fieldName]: ["unreadable form"],
      });
    }
    const file = form.get(fieldName);
    if (!(file instanceof Blob)) {
      throw new HttpError(422, `No file in the form field "${fieldName}"; attach the CSV file there.`, {
        [fieldName]: ["a CSV file is required"],
      });
    }
    if (file.size > maxBytes) throw tooLarge(maxBytes, file.size);
    const fields: Record<string, string> = {};
    for (const [k, v] of form.entries()) if (typeof v === "string") fields[k] = v;
    const fileName = ("name" in file && typeof file.name === "string" && file.name.trim()) || "upload.csv";
    return { fileName: storableFileName(fileName, fieldName), text: await file.text(), fields };
  }
  if (type.startsWith("text/csv") || type.startsWith("text/plain") || type.startsWith("application/csv")) {
    const name = new URL(request.url).searchParams.get("name")?.trim();
    return { fileName: storableFileName(name || "upload.csv", fieldName), text: await body.text(), fields: {} };
  }
  throw new HttpError(422, `Send the CSV as multipart/form-data in the field "${fieldName}" (or as a text/csv body).`, {
    [fieldName]: ["a CSV file is required"],
  });
}
