import { randomUUID } from 'node:crypto';
import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import exifr from 'exifr';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentHarness, type PaymentHarness } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

/**
 * Uploaded photos are re-encoded: no EXIF (so no camera position) goes back out, the picture is
 * turned upright first, and the bytes served are never the bytes uploaded. The EXIF is written
 * with sharp and read back with exifr, an EXIF parser of its own (npm `exifr`), so the check does
 * not trust the library that strips it.
 *
 * Tag meanings: CIPA DC-008 "Exif 2.32", §4.6.4 (Orientation 0x0112: 6 = the 0th row is the
 * visual right-hand side, i.e. the picture must be turned 90° clockwise to be upright) and §4.6.6
 * (GPS IFD: GPSLatitude/GPSLongitude as degrees, minutes, seconds rationals with N/S, E/W refs).
 */

const WIDTH = 64;
const HEIGHT = 48;

/** A gradient whose corners can be told apart: red follows x, green follows y, blue is fixed. */
function gradientPixels(width = WIDTH, height = HEIGHT): Buffer {
  const raw = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      raw[i] = Math.round((x / (width - 1)) * 250);
      raw[i + 1] = Math.round((y / (height - 1)) * 250);
      raw[i + 2] = 128;
    }
  }
  return raw;
}

/** A phone-style JPEG: camera make and model, a GPS position and Orientation 6 (held sideways). */
async function jpegWithLocation(width = WIDTH, height = HEIGHT): Promise<Buffer> {
  return sharp(gradientPixels(width, height), { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 95 })
    .withExif({
      IFD0: { Make: 'Inventcam', Model: 'Bench Seven' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '12/1 34/1 56/1', GPSLongitudeRef: 'W', GPSLongitude: '65/1 43/1 21/1' },
    })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

/**
 * The chunk names of a WebP file, read by hand from its RIFF container (WebP Container
 * Specification, developers.google.com/speed/webp/docs/riff_container: "RIFF", size, "WEBP", then
 * chunks of FourCC, little-endian size and data padded to an even length). exifr does not read
 * WebP; metadata would sit in "EXIF" and "XMP " chunks.
 */
function webpChunks(file: Buffer): string[] {
  expect(file.toString('ascii', 0, 4)).toBe('RIFF');
  expect(file.toString('ascii', 8, 12)).toBe('WEBP');
  const names: string[] = [];
  for (let at = 12; at + 8 <= file.length;) {
    const size = file.readUInt32LE(at + 4);
    names.push(file.toString('ascii', at, at + 4));
    at += 8 + size + (size % 2);
  }
  return names;
}

async function pixelAt(image: Buffer, x: number, y: number): Promise<number[]> {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return [data[i]!, data[i + 1]!, data[i + 2]!];
}

describe('uploaded photos are re-encoded without their metadata', () => {
  let h: PaymentHarness;
  let player: Awaited<ReturnType<PaymentHarness['signIn']>>;
  let bookingId: string;

  beforeAll(async () => {
    h = await startPaymentHarness();
    player = await h.signIn('player@mail.example');
    const res = await player.post('/api/bookings').send({ configuration: countedBoard(4) });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    bookingId = res.body.id;
  }, 60_000);
  afterAll(async () => h?.close());

  const upload = (bytes: Buffer, filename: string, contentType: string) =>
    player.post(`/api/bookings/${bookingId}/photos`).attach('file', bytes, { filename, contentType });
  const photoRows = () => h.t.db.selectFrom('photos').selectAll().where('booking_id', '=', bookingId).execute();

  it('serves a photo with a GPS position back without it, turned upright, and not byte for byte', async () => {
    const original = await jpegWithLocation();
    // The upload really carries the position and orientation (read by exifr, not by sharp).
    const before = await exifr.gps(original);
    expect(before.latitude).toBeCloseTo(12 + 34 / 60 + 56 / 3600, 4);
    expect(before.longitude).toBeCloseTo(-(65 + 43 / 60 + 21 / 3600), 4);
    expect(await exifr.orientation(original)).toBe(6);
    expect((await exifr.parse(original))?.Make).toBe('Inventcam');

    const res = await upload(original, 'board.jpg', 'image/jpeg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ contentType: 'image/jpeg', width: HEIGHT, height: WIDTH });
    expect(res.body.thumbnailUrl).toBe(`${res.body.url}/thumbnail`);

    const served = await player.get(res.body.url).buffer(true).expect(200);
    expect(served.headers['content-type']).toBe('image/jpeg');
    const bytes = served.body as Buffer;
    expect(Buffer.compare(bytes, original)).not.toBe(0);
    // No EXIF block at all: no position, no camera, no orientation left to apply twice.
    expect(await exifr.gps(bytes)).toBeUndefined();
    expect(await exifr.parse(bytes, true)).toBeUndefined();
    expect(await exifr.orientation(bytes)).toBeUndefined();
    // Upright: 48 wide and 64 tall. Turned 90° clockwise, the stored bottom-left corner (red 0,
    // green 250) is now the top-left, and the stored top-left (red 0, green 0) the top-right.
    const meta = await sharp(bytes).metadata();
    expect([meta.width, meta.height]).toEqual([HEIGHT, WIDTH]);
    const [topLeft, topRight] = [await pixelAt(bytes, 1, 1), await pixelAt(bytes, HEIGHT - 2, 1)];
    expect(topLeft[0]).toBeLessThan(40);
    expect(topLeft[1]).toBeGreaterThan(200);
    expect(topRight[0]).toBeLessThan(40);
    expect(topRight[1]).toBeLessThan(40);

    // What is kept on disk is the re-encoded copy too: the uploaded bytes are nowhere.
    const [row] = await photoRows();
    const stored = await readFile(path.join(h.uploadsDir, row!.storage_key));
    expect(Buffer.compare(stored, bytes)).toBe(0);
    expect(await exifr.gps(stored)).toBeUndefined();
  });

  it('keeps a list-sized WebP copy, also without metadata', async () => {
    const res = await upload(await jpegWithLocation(1200, 900), 'wide.jpg', 'image/jpeg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const thumb = await player.get(res.body.thumbnailUrl).buffer(true).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    const meta = await sharp(thumb.body as Buffer).metadata();
    // Upright (900 × 1200 after Orientation 6), scaled to 480 on the long edge.
    expect([meta.format, meta.width, meta.height]).toEqual(['webp', 360, 480]);
    const chunks = webpChunks(thumb.body as Buffer);
    expect(chunks.some((c) => c === 'VP8 ' || c === 'VP8L')).toBe(true);
    expect(chunks).not.toContain('EXIF');
    expect(chunks).not.toContain('XMP ');
    const full = await sharp((await player.get(res.body.url).buffer(true).expect(200)).body as Buffer).metadata();
    expect([full.width, full.height]).toEqual([900, 1200]);
    // Someone else's booking: neither copy.
    const other = await h.signIn('cass@mail.example');
    await other.get(res.body.thumbnailUrl).expect(404);
  });

  it('drops whatever rides behind the image: bytes appended after the PNG end chunk are not served', async () => {
    const png = await sharp(gradientPixels(), { raw: { width: WIDTH, height: HEIGHT, channels: 3 } })
      .png()
      .toBuffer();
    const payload = Buffer.from('PK\u0003\u0004 a second file hidden behind the picture');
    const res = await upload(Buffer.concat([png, payload]), 'plain.png', 'image/png');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const served = (await player.get(res.body.url).buffer(true).expect(200)).body as Buffer;
    expect(served.includes(payload)).toBe(false);
    expect(await pixelAt(served, WIDTH - 1, 0)).toEqual([250, 0, 128]);
  });

  it('refuses a damaged photo or a decompression bomb in words, and stores nothing', async () => {
    const before = await photoRows();
    const filesBefore = await readdir(path.join(h.uploadsDir, bookingId));
    const whole = await jpegWithLocation(400, 300);
    const cut = await upload(whole.subarray(0, Math.floor(whole.length / 2)), 'cut.jpg', 'image/jpeg');
    expect(cut.status).toBe(400);
    expect(cut.body.message).toMatch(/could not be read/);

    // A valid PNG header announcing 20,000 × 20,000 pixels (400 megapixels) around a few bytes:
    // PNG spec (W3C PNG 2nd ed. §11.2.2 IHDR). Decoding it would need gigabytes of memory.
    const bomb = Buffer.from(
      await sharp(gradientPixels(), { raw: { width: WIDTH, height: HEIGHT, channels: 3 } })
        .png()
        .toBuffer(),
    );
    bomb.writeUInt32BE(20_000, 16);
    bomb.writeUInt32BE(20_000, 20);
    const big = await upload(bomb, 'huge.png', 'image/png');
    expect(big.status).toBe(400);
    expect(big.body.message).toMatch(/megapixels/);

    expect(await photoRows()).toHaveLength(before.length);
    expect(await readdir(path.join(h.uploadsDir, bookingId))).toEqual(filesBefore);
  });

  it('re-encodes a photo stored before uploads were re-encoded the first time it is read, and removes the original', async () => {
    const original = await jpegWithLocation();
    const key = `${bookingId}/${randomUUID()}.jpg`;
    await mkdir(path.join(h.uploadsDir, bookingId), { recursive: true });
    await writeFile(path.join(h.uploadsDir, key), original);
    const uploader = await h.t.db.selectFrom('users').select('id').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    const legacy = await h.t.db
      .insertInto('photos')
      .values({
        booking_id: bookingId,
        uploaded_by: uploader.id,
        kind: 'customer',
        storage_key: key,
        content_type: 'image/jpeg',
        size_bytes: original.length,
        thumbnail_key: null,
        width: null,
        height: null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();

    const url = `/api/bookings/${bookingId}/photos/${legacy.id}`;
    const [full, thumb] = await Promise.all([
      player.get(url).buffer(true).expect(200),
      player.get(`${url}/thumbnail`).buffer(true).expect(200),
    ]);
    expect(Buffer.compare(full.body as Buffer, original)).not.toBe(0);
    expect(await exifr.gps(full.body as Buffer)).toBeUndefined();
    expect(webpChunks(thumb.body as Buffer)).not.toContain('EXIF');
    const row = await h.t.db.selectFrom('photos').selectAll().where('id', '=', legacy.id).executeTakeFirstOrThrow();
    expect(row.storage_key).not.toBe(key);
    expect(row.thumbnail_key).toMatch(/\.thumb\.webp$/);
    expect([row.width, row.height]).toEqual([HEIGHT, WIDTH]);
    const files = await readdir(path.join(h.uploadsDir, bookingId));
    expect(files).not.toContain(key.split('/')[1]);
    // Two readers at once re-encode it once: every file on disk belongs to a row.
    const keys = (await photoRows()).flatMap((r) => [r.storage_key, r.thumbnail_key]).map((k) => k!.split('/')[1]);
    expect(files.sort()).toEqual(keys.sort());
  });
});
