import { GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { objectStoreEnv, startScratchObjectStore } from './support/fakes-env';
import { signIn as signInTo } from './support/bench-fixtures';

const board = countedBoard(4);

/**
 * PHOTO_STORAGE=s3: photos go to an S3-compatible bucket through @aws-sdk/client-s3 (here the
 * local s3rver that `npm start` runs too) and come back only through the API's authorised routes.
 */
describe('photos in S3-compatible object storage', () => {
  let store: Awaited<ReturnType<typeof startScratchObjectStore>>;
  let t: TestApp;
  let s3: S3Client;

  beforeAll(async () => {
    store = await startScratchObjectStore('lw-photos-test');
    t = await createTestApp({ env: objectStoreEnv(store) });
    s3 = new S3Client({
      region: 'us-east-1',
      endpoint: store.url,
      forcePathStyle: true,
      credentials: { accessKeyId: store.accessKeyId, secretAccessKey: store.secretAccessKey },
    });
  }, 60_000);
  afterAll(async () => {
    await t?.close();
    await store?.dispose();
  });

  const signIn = (email: string) => signInTo(t.app, email);

  it("stores the photo and its thumbnail in the bucket and serves them to the booking's people only", async () => {
    const player = await signIn('player@mail.example');
    const booking = await player.post('/api/bookings').send({ configuration: board }).expect(201);
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 180, g: 90, b: 30 } } })
      .png()
      .toBuffer();
    const uploaded = await player
      .post(`/api/bookings/${booking.body.id}/photos`)
      .attach('file', png, { filename: 'board.png', contentType: 'image/png' });
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);

    const row = await t.db.selectFrom('photos').selectAll().where('id', '=', uploaded.body.id).executeTakeFirstOrThrow();
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: `${booking.body.id}/` }));
    expect(listed.Contents?.map((o) => o.Key).sort()).toEqual([row.storage_key, row.thumbnail_key].sort());
    // The object carries its content type, so a bucket browser or CDN shows it right too.
    expect((await s3.send(new HeadObjectCommand({ Bucket: store.bucket, Key: row.storage_key }))).ContentType).toBe('image/png');

    const served = await player.get(uploaded.body.url).buffer(true).expect(200);
    expect(served.headers['content-type']).toBe('image/png');
    const inBucket = Buffer.from(
      await (await s3.send(new GetObjectCommand({ Bucket: store.bucket, Key: row.storage_key }))).Body!.transformToByteArray(),
    );
    expect(Buffer.compare(served.body as Buffer, inBucket)).toBe(0);
    expect((await sharp(served.body as Buffer).metadata()).width).toBe(64);
    const thumb = await player.get(uploaded.body.thumbnailUrl).buffer(true).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');

    // Another player, and nobody signed in, get nothing; the shop's staff see it.
    const other = await signIn('cass@mail.example');
    expect((await other.get(uploaded.body.url)).status).toBe(404);
    expect((await t.http().get(uploaded.body.url)).status).toBe(401);
    await (await signIn('owner@shop.example')).get(uploaded.body.url).expect(200);
  });
});
