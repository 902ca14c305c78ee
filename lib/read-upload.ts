// Reads an uploaded CSV from a request: multipart with a `file` field, or a bare text/csv body.
// Too large is refused from Content-Length before reading, and again while the bytes stream in,
// so an 11 MB body never gets parsed (a missing or lying Content-Length cannot get around it).
import { HttpError } from "@/lib/http";
import { MULTIPART_SLACK_BYTES } from "@/lib/profile/limits";

export type UploadedText = { fileName: string; text: string; fields: Record<string, string> };

const megabytes = (bytes: number) => `${Number((bytes / 1e6).toPrecision(3))} MB`;

function tooLarge(maxBytes: number, size?: number): HttpError {
  return new HttpError(
    413,
    `The file is larger than ${megabytes(maxBytes)}${size !== undefined ? ` (it is ${megabytes(size)})` : ""}; nothing was stored.`,
  );
}

/** The body, counted as it arrives: over `limit` bytes stops the read with 413. */
async function countedBody(request: Request, limit: number, maxBytes: number): Promise<Response> {
  if (!request.body) return new Response("");
  let total = 0;
  let over = false;
  const counter = new TransformStream<Uint8Array, Uint8Array>({
    transform(chunk, controller) {
      total += chunk.byteLength;
      if (total > limit) {
        over = true;
        controller.error(tooLarge(maxBytes));
      } else controller.enqueue(chunk);
    },
  });
  const stream = request.body.pipeThrough(counter);
  // Buffer here (at most `limit` bytes) so a refusal surfaces as ours, not as a parser's error.
  const chunks: Uint8Array[] = [];
  const reader = stream.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      chunks.push(value);
    }
  } catch (e) {
    if (over) throw tooLarge(maxBytes);
    throw new HttpError(422, "The upload was interrupted before the whole file arrived; nothing was stored.", {
      file: ["upload interrupted"],
    });
  }
  return new Response(new Blob(chunks as BlobPart[]), {
    headers: { "content-type": request.headers.get("content-type") ?? "" },
  });
}

export async function readCsvUpload(request: Request, maxBytes: number, fieldName = "file"): Promise<UploadedText> {
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  const multipart = type.startsWith("multipart/form-data");
  const limit = maxBytes + (multipart ? MULTIPART_SLACK_BYTES : 0);
  const declared = Number(request.headers.get("content-length") ?? "");
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
    return { fileName: fileName.slice(0, 200), text: await file.text(), fields };
  }
  if (type.startsWith("text/csv") || type.startsWith("text/plain") || type.startsWith("application/csv")) {
    const name = new URL(request.url).searchParams.get("name")?.trim();
    return { fileName: (name || "upload.csv").slice(0, 200), text: await body.text(), fields: {} };
  }
  throw new HttpError(422, `Send the CSV as multipart/form-data in the field "${fieldName}" (or as a text/csv body).`, {
    [fieldName]: ["a CSV file is required"],
  });
}
