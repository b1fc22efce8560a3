// Uploads through the API with STORAGE_DRIVER=s3 against a local S3-compatible store (s3rver):
// photos, underlays and logos land in the bucket (not in the local folder) and are served back,
// and a quote PDF embeds the logo read from the bucket.
import { DeleteObjectCommand, HeadObjectCommand, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobPhoto } from '../../server/db/models';
import { pngImage } from '../helpers/images';
import { startS3Fake, type S3Fake } from '../helpers/s3-fake';
import { createTestContext, loginAs, type TestContext } from '../helpers/test-app';
import { filesUnder, rotatedJpeg, scheduledJobWithTakeoff } from './job-sheet-fixtures';
import { binary, quoteCompany, quoteJob } from './quotes-fixtures';

let fake: S3Fake;
let ctx: TestContext;
let raw: S3Client;
let org: Awaited<ReturnType<typeof quoteCompany>>;

beforeAll(async () => {
  fake = await startS3Fake();
  ctx = await createTestContext(fake.env);
  raw = new S3Client({ endpoint: fake.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } });
  org = await quoteCompany();
});
afterAll(async () => {
  raw?.destroy();
  await ctx?.close();
  await fake?.close();
});

/** The object's size and type in the bucket, or null when there is none. */
async function inBucket(key: string) {
  try {
    const head = await raw.send(new HeadObjectCommand({ Bucket: fake.bucket, Key: key }));
    return { size: head.ContentLength, type: head.ContentType };
  } catch (e) {
    if ((e as { name?: string }).name === 'NotFound') return null;
    throw e;
  }
}

describe('uploads with the S3 driver', () => {
  it('uses the bucket', () => {
    expect(ctx.deps.storage.driver).toBe('s3');
  });

  it('stores a site photo and its thumbnail in the bucket and serves both back', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const installer = await loginAs(ctx.app, org.installer);
    const res = await installer
      .post(`/api/jobs/${job.id}/photos`)
      .set('Idempotency-Key', `s3-photo-${job.id}`)
      .field('spaceId', space.id)
      .field('stage', 'before')
      .field('caption', 'Hatch before')
      .attach('photo', await rotatedJpeg(), { filename: 'IMG_0001.JPG', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    const row = await JobPhoto.findByPk(res.body.photo.id, { rejectOnEmpty: true });
    expect(await inBucket(row.storageKey)).toEqual({ size: row.bytes, type: 'image/jpeg' });
    expect(await inBucket(row.thumbKey)).toMatchObject({ type: 'image/jpeg' });
    expect(filesUnder(ctx.config.uploadDir).filter((f) => f.endsWith('.jpg'))).toEqual([]);

    const full = await installer.get(res.body.photo.url).buffer(true).parse(binary);
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    expect((full.body as Buffer).length).toBe(row.bytes);
    const meta = await sharp(full.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    const thumb = await installer.get(res.body.photo.thumbUrl).buffer(true).parse(binary);
    expect(
      Math.max(
        ...(await sharp(thumb.body as Buffer)
          .metadata()
          .then((m) => [m.width!, m.height!])),
      ),
    ).toBeLessThanOrEqual(320);

    // The file gone from the bucket (removed there by hand): a 404 naming it, not a 500.
    await raw.send(new DeleteObjectCommand({ Bucket: fake.bucket, Key: row.thumbKey }));
    const gone = await installer.get(res.body.photo.thumbUrl);
    expect(gone.status).toBe(404);
    expect(gone.body.error.message).toBe('photo file not found');
  });

  it('stores a plan underlay in the bucket and serves it back; an unknown one is a 404', async () => {
    const { space } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const png = await pngImage(64, 48);
    const up = await office.post(`/api/spaces/${space.id}/background`).attach('image', png, 'drawing.png');
    expect(up.status).toBe(201);
    const name = String(up.body.url).split('/').pop();
    expect(await inBucket(`${org.id}/plan-backgrounds/${space.id}/${name}`)).toEqual({ size: png.length, type: 'image/png' });
    const back = await office.get(up.body.url).buffer(true).parse(binary);
    expect(back.status).toBe(200);
    expect(back.headers['content-type']).toBe('image/png');
    expect((back.body as Buffer).equals(png)).toBe(true);
    const unknown = await office.get(`/api/spaces/${space.id}/background/${'0'.repeat(8)}-0000-0000-0000-${'0'.repeat(12)}.png`);
    expect(unknown.status).toBe(404);
  });

  it('stores the company logo in the bucket, serves it, draws it into the quote PDF, and removes it', async () => {
    const office = await loginAs(ctx.app, org.office);
    const { job } = await quoteJob(org);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const pdfBefore = (await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary)).body as Buffer;
    const logo = await sharp({ create: { width: 120, height: 40, channels: 3, background: { r: 30, g: 90, b: 60 } } })
      .png()
      .toBuffer();
    expect((await office.post('/api/settings/logo').attach('logo', logo, { filename: 'logo.png', contentType: 'image/png' })).status).toBe(200);
    expect(await inBucket(`${org.id}/logo/logo.png`)).toEqual({ size: logo.length, type: 'image/png' });
    const back = await office.get('/api/settings/logo').buffer(true).parse(binary);
    expect((back.body as Buffer).equals(logo)).toBe(true);

    // pdfkit embeds the PNG as an image XObject: the quote without a logo has none.
    const images = (pdf: Buffer) => (pdf.toString('latin1').match(/\/Subtype \/Image/g) ?? []).length;
    const pdfAfter = (await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary)).body as Buffer;
    expect(images(pdfAfter)).toBeGreaterThan(images(pdfBefore));

    expect((await office.delete('/api/settings/logo')).status).toBe(200);
    expect(await inBucket(`${org.id}/logo/logo.png`)).toBeNull();
    expect((await office.get('/api/settings/logo')).status).toBe(404);
  });
});
