import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pngImage } from '../helpers/images';
import { createTestContext, createJob, createOrgWithUsers, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx.close());

describe('temporary upload files', () => {
  it('are removed at start when a killed process left them, and finished files are kept', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-orphans-'));
    const folder = path.join(dir, 'org-1', 'photos');
    fs.mkdirSync(folder, { recursive: true });
    const orphan = path.join(folder, 'a1b2.jpg.4242.1767225600000.tmp');
    const fresh = path.join(folder, 'c3d4.jpg.4243.1767225600001.tmp');
    const kept = path.join(folder, 'a1b2.jpg');
    for (const f of [orphan, fresh, kept]) fs.writeFileSync(f, 'x');
    const hourAgo = new Date(Date.now() - 3_600_000);
    fs.utimesSync(orphan, hourAgo, hourAgo);
    const other = await createTestContext({ UPLOAD_DIR: dir });
    try {
      expect(fs.existsSync(orphan)).toBe(false);
      // A file still being written by another server sharing the folder (minutes old at most) stays.
      expect(fs.existsSync(fresh)).toBe(true);
      expect(fs.existsSync(kept)).toBe(true);
    } finally {
      await other.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

/** A PNG whose header claims `width` × `height` pixels around a 1 × 1 image (a decompression bomb's header). */
async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const png = Buffer.from(await pngImage(1, 1));
  // IHDR: 8-byte signature, 4-byte length, 'IHDR', then width and height, then 5 bytes, then the CRC.
  png.writeUInt32BE(width, 16);
  png.writeUInt32BE(height, 20);
  png.writeUInt32BE(zlib.crc32(png.subarray(12, 29)), 29);
  return png;
}

/** A multipart body with one file whose name is given raw (a NUL byte cannot go through a form library). */
function multipart(field: string, filename: string, bytes: Buffer) {
  const boundary = 'quiltlineboundary';
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="${field}"; filename="${filename}"\r\nContent-Type: image/png\r\n\r\n`,
    'latin1',
  );
  return { type: `multipart/form-data; boundary=${boundary}`, body: Buffer.concat([head, bytes, Buffer.from(`\r\n--${boundary}--\r\n`)]) };
}

describe('image uploads', () => {
  it('refuses a NUL byte in the file name of an underlay, a logo and a photo with a 4xx, storing nothing', async () => {
    const { job, space } = await createJob(org, { assignedInstallerId: org.installer.id, stage: 'scheduled' });
    const png = await pngImage(8, 8);
    const office = await loginAs(ctx.app, org.office);
    const installer = await loginAs(ctx.app, org.installer);
    const targets = [
      { agent: office, url: `/api/spaces/${space.id}/background`, field: 'image' },
      { agent: office, url: '/api/settings/logo', field: 'logo' },
      { agent: installer, url: `/api/jobs/${job.id}/photos`, field: 'photo' },
    ];
    for (const t of targets) {
      const m = multipart(t.field, 'plan\u0000.png', png);
      const res = await t.agent.post(t.url).set('Content-Type', m.type).send(m.body);
      expect(res.status, t.url).toBeGreaterThanOrEqual(400);
      expect(res.status, t.url).toBeLessThan(500);
    }
    expect(fs.readdirSync(ctx.config.uploadDir, { recursive: true }).filter((f) => String(f).endsWith('.png'))).toEqual([]);
  });

  it('answers 413 for a logo over 1 MB (it was a 500)', async () => {
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post('/api/settings/logo').attach('logo', Buffer.alloc(1024 * 1024 + 1), 'logo.png');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('logo_too_large');
  });

  it('answers 413 naming the size for a 60,000² PNG as logo, underlay or photo, before decoding it', async () => {
    const { job, space } = await createJob(org, { assignedInstallerId: org.installer.id, stage: 'scheduled' });
    const bomb = await pngClaiming(60_000, 60_000);
    expect(bomb.length).toBeLessThan(200);
    const office = await loginAs(ctx.app, org.office);
    const installer = await loginAs(ctx.app, org.installer);
    const logo = await office.post('/api/settings/logo').attach('logo', bomb, 'logo.png');
    const underlay = await office.post(`/api/spaces/${space.id}/background`).attach('image', bomb, 'scan.png');
    const photo = await installer
      .post(`/api/jobs/${job.id}/photos`)
      .set('Idempotency-Key', `bomb-${job.id}`)
      .field('spaceId', space.id)
      .field('stage', 'before')
      .attach('photo', bomb, 'site.png');
    for (const res of [logo, underlay, photo]) {
      expect(res.status).toBe(413);
      expect(res.body.error.code).toBe('image_too_many_pixels');
      expect(res.body.error.message).toMatch(/60,000 × 60,000/);
    }
  });

  it('still takes an underlay of ordinary size', async () => {
    const { space } = await createJob(org);
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post(`/api/spaces/${space.id}/background`).attach('image', await pngImage(1200, 800), 'scan.png');
    expect(res.status).toBe(201);
  });
});
