import type { Response } from 'superagent';
import type { Test } from 'supertest';

/** The answer's bytes whatever its type (supertest leaves a PDF unread otherwise). */
export function bytesOf(call: Test): Promise<Response & { body: Buffer }> {
  return call.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  }) as unknown as Promise<Response & { body: Buffer }>;
}
