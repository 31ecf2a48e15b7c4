// Reading a request body within a byte limit: a declared Content-Length above the limit is refused at once, and a body
// without one (chunked) is counted as it arrives and abandoned as soon as the count passes the limit.

export type BodyText = { ok: true; text: string } | { ok: false; reason: 'too-large' | 'not-utf8' };

/**
 * The body as UTF-8 text, or why it was refused. Never reads more than `maxBytes` (plus one chunk) from the stream.
 *
 * @example
 * const body = await readBodyText(request, 1_000_000);
 * if (!body.ok) return jsonError(body.reason === 'too-large' ? 413 : 400, '…');
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<BodyText> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) return { ok: false, reason: 'too-large' };
  if (!request.body) return { ok: true, text: '' };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => {});
      return { ok: false, reason: 'too-large' };
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.byteLength;
  }
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    return { ok: false, reason: 'not-utf8' };
  }
}
