import type request from 'supertest';

/** The body as bytes whatever its type (supertest unzips a gzip body on the way; Content-Length tells the size sent). */
export const rawBody = (req: request.Test) =>
  req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
