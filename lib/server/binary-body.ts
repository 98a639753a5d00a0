// Reading a binary request body without trusting its size: refused from Content-Length when that
// already says too much, and counted while streaming otherwise, so an oversized upload is cut off
// at the limit instead of being held in memory whole.
import "server-only";
import { AppError } from "@/lib/http/app-error";

function formatSize(bytes: number): string {
  const mebibytes = bytes / (1024 * 1024);
  return mebibytes >= 1 ? `${Number(mebibytes.toFixed(1))} MiB` : `${Math.ceil(bytes / 1024)} KiB`;
}

function tooLarge(subject: string, limitBytes: number): AppError {
  return new AppError(`payload_too_large:${subject}`, `The upload is larger than the ${formatSize(limitBytes)} this server accepts.`);
}

export async function readBinaryBody(request: Request, { limitBytes, subject }: { limitBytes: number; subject: string }): Promise<Uint8Array> {
  const contentType = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (contentType !== "application/octet-stream") {
    throw new AppError(`bad_request:${subject}`, "content-type: send the payload as application/octet-stream.", [{ path: "content-type", message: "expected application/octet-stream" }]);
  }
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > limitBytes) throw tooLarge(subject, limitBytes);
  if (!request.body) return new Uint8Array(0);

  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > limitBytes) {
      await reader.cancel();
      throw tooLarge(subject, limitBytes);
    }
    chunks.push(value);
  }
  if (chunks.length === 1) return chunks[0]!;
  const body = new Uint8Array(received);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}
