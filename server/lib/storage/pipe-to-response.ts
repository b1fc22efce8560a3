import type { Response } from 'express';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

/**
 * Streams a stored file into the answer, the headers already set. A failure before the first byte
 * goes to the error handler; after it (the reader left, the store broke off) the connection is
 * already closed by the pipeline and there is no answer left to give.
 */
export async function pipeToResponse(res: Response, body: Readable): Promise<void> {
  try {
    await pipeline(body, res);
  } catch (e) {
    if (!res.headersSent) throw e;
  }
}
