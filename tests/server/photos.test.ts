import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobPhoto } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { filesUnder, priceKeyPaths, rotatedJpeg, scheduledJobWithTakeoff } from './job-sheet-fixtures';

/** The company's photo folder: the data folder also holds files of its own (the local payments secret). */
const photosDir = () => path.join(ctx.config.uploadDir, org.id, 'photos');

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

describe('POST /api/jobs/:id/photos', () => {
  it('stores an upright copy (EXIF orientation applied) and a thumbnail, once per idempotency key', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const jpeg = await rotatedJpeg();
    const send = () =>
      agent
        .post(`/api/jobs/${job.id}/photos`)
        .set('Idempotency-Key', `photo-${job.id}`)
        .field('spaceId', space.id)
        .field('stage', 'before')
        .field('caption', 'Hatch before')
        .attach('photo', jpeg, { filename: 'IMG_0001.JPG', contentType: 'image/jpeg' });
    const res = await send();
    expect(res.status).toBe(201);
    expect(priceKeyPaths(res.body)).toEqual([]);
    // Stored 400 × 200 with "rotate 90°": upright it is 200 wide, 400 high.
    expect([res.body.photo.widthPx, res.body.photo.heightPx]).toEqual([200, 400]);
    const full = await agent.get(res.body.photo.url).buffer(true);
    expect(full.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(full.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    expect(meta.orientation ?? 1).toBe(1);
    const thumb = await agent.get(res.body.photo.thumbUrl).buffer(true);
    const tmeta = await sharp(thumb.body as Buffer).metadata();
    expect(Math.max(tmeta.width!, tmeta.height!)).toBeLessThanOrEqual(320);

    const again = await send();
    expect(again.status).toBe(201);
    expect(again.body.photo.id).toBe(res.body.photo.id);
    expect(await JobPhoto.count({ where: { jobId: job.id } })).toBe(1);
    expect(filesUnder(photosDir())).toHaveLength(2);
  });

  it('refuses a text file renamed .jpg, and stores nothing', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const before = filesUnder(photosDir()).length;
    const res = await agent
      .post(`/api/jobs/${job.id}/photos`)
      .field('spaceId', space.id)
      .field('stage', 'after')
      .attach('photo', Buffer.from('These are my notes, not a photo.\n'.repeat(20)), { filename: 'loft.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('not_an_image');
    expect(res.body.error.message).toMatch(/JPEG, PNG or WebP/);
    expect(await JobPhoto.count({ where: { jobId: job.id } })).toBe(0);
    expect(filesUnder(photosDir())).toHaveLength(before);
  });

  it('refuses an image over the size limit with a clear message, and stores nothing', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const before = filesUnder(photosDir()).length;
    // A real JPEG header followed by padding: 16 MB, over the 15 MB limit.
    const big = Buffer.concat([await rotatedJpeg(), Buffer.alloc(16 * 1024 * 1024)]);
    const res = await agent
      .post(`/api/jobs/${job.id}/photos`)
      .field('spaceId', space.id)
      .field('stage', 'after')
      .attach('photo', big, { filename: 'huge.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('photo_too_large');
    expect(res.body.error.message).toMatch(/15 MB/);
    expect(await JobPhoto.count({ where: { jobId: job.id } })).toBe(0);
    expect(filesUnder(photosDir())).toHaveLength(before);
  });

  it('needs the photo, a space of this job and a stage', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const noFile = await agent.post(`/api/jobs/${job.id}/photos`).field('spaceId', space.id).field('stage', 'after');
    expect(noFile.status).toBe(422);
    expect(noFile.body.error.details[0].path).toBe('photo');
    const badStage = await agent
      .post(`/api/jobs/${job.id}/photos`)
      .field('spaceId', space.id)
      .field('stage', 'someday')
      .attach('photo', await rotatedJpeg(), 'a.jpg');
    expect(badStage.status).toBe(422);
    expect(badStage.body.error.details[0].path).toBe('stage');
  });

  it("keeps another installer's and another company's photos out of reach", async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const res = await agent
      .post(`/api/jobs/${job.id}/photos`)
      .field('spaceId', space.id)
      .field('stage', 'during')
      .attach('photo', await rotatedJpeg(), 'a.jpg');
    expect(res.status).toBe(201);
    const otherOrg = await createOrgWithUsers(ctx);
    const stranger = await loginAs(ctx.app, otherOrg.office);
    expect((await stranger.get(res.body.photo.url)).status).toBe(404);
    const stranger2 = await loginAs(ctx.app, otherOrg.installer);
    expect(
      (
        await stranger2
          .post(`/api/jobs/${job.id}/photos`)
          .field('spaceId', space.id)
          .field('stage', 'during')
          .attach('photo', await rotatedJpeg(), 'a.jpg')
      ).status,
    ).toBe(404);
    const office = await loginAs(ctx.app, org.office);
    expect((await office.get(res.body.photo.thumbUrl)).status).toBe(200);
  });
});
