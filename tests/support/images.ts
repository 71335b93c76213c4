import zlib from 'node:zlib';
import sharp from 'sharp';

// Generated test images: nothing binary is checked in, every file is built from its recipe here.

export async function jpegPhoto(width = 640, height = 480, opts: { gps?: boolean } = {}): Promise<Buffer> {
  let img = sharp({ create: { width, height, channels: 3, background: { r: 60, g: 110, b: 50 } } }).jpeg({ quality: 80 });
  if (opts.gps) {
    img = img.withExif({
      IFD0: { Make: 'TestCam', Model: 'Unit 1' },
      // IFD3 is the GPS directory: a position in degrees/minutes/seconds.
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 12/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 39/1' },
    });
  }
  return img.toBuffer();
}

export async function pngPhoto(width = 320, height = 240): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 4, background: { r: 200, g: 180, b: 120, alpha: 1 } } })
    .png()
    .toBuffer();
}

export async function webpPhoto(width = 320, height = 240): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 90, g: 70, b: 50 } } })
    .webp()
    .toBuffer();
}

export const svgWithScript = Buffer.from(
  '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(document.cookie)</script><rect width="10" height="10"/></svg>',
);

export const htmlRenamedPng = Buffer.from('<!doctype html><html><body><script>alert(document.cookie)</script></body></html>');

/** A file that is both a GIF (its header) and a script (the header is a comment, then code). */
export function gifJsPolyglot(): Buffer {
  const head = Buffer.from('GIF89a/*', 'latin1');
  // Logical screen: the "/*" above is read as width 0x2a2f; then flags, background, aspect.
  const screen = Buffer.from([0x0a, 0x00, 0x00, 0x00, 0x00]);
  const image = Buffer.from([0x2c, 0, 0, 0, 0, 1, 0, 1, 0, 0, 0x02, 0x02, 0x44, 0x01, 0x00, 0x3b]);
  const tail = Buffer.from('*/=1;alert(document.cookie);//', 'latin1');
  return Buffer.concat([head, screen, image, tail]);
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(typed) >>> 0);
  return Buffer.concat([len, typed, crc]);
}

/**
 * A small, valid PNG whose header claims width × height (1-bit greyscale): its pixel data
 * compresses to kilobytes but would take width × height bytes of memory to decode.
 */
export function hugePixelPng(width = 20000, height = 20000): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const rowBytes = 1 + Math.ceil(width / 8);
  const idat = zlib.deflateSync(Buffer.alloc(rowBytes * height), { level: 9 });
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', idat),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** A JPEG followed by HTML: a polyglot that a browser sniffing the bytes might run. */
export async function jpegHtmlPolyglot(): Promise<Buffer> {
  return Buffer.concat([await jpegPhoto(64, 64), Buffer.from('<html><script>alert(document.cookie)</script></html>')]);
}

/** Bytes that start like a JPEG and are larger than the 10 MB limit. */
export function oversizeJpegLike(bytes = 10 * 1024 * 1024 + 1): Buffer {
  const b = Buffer.alloc(bytes, 0x20);
  b.set([0xff, 0xd8, 0xff, 0xe0], 0);
  return b;
}
