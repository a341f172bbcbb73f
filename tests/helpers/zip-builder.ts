/**
 * Builds ZIP archives byte by byte for the upload tests, including the malformed ones a hostile sender makes:
 * a directory that understates a file's size, entries that share bytes, names with `../`, encrypted entries.
 */
import zlib from 'node:zlib';

export interface ZipPart {
  name: string;
  data: Buffer | string;
  /** 0 stored, 8 deflated (default) */
  method?: 0 | 8;
  /** The size the directory states (default: the true size). */
  statedBytes?: number;
  /** General-purpose flags (bit 0: encrypted). */
  flags?: number;
}

export function buildZip(parts: ZipPart[], options: { shareFirstEntryData?: boolean } = {}): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  let firstOffset = 0;
  parts.forEach((p, k) => {
    const raw = Buffer.isBuffer(p.data) ? p.data : Buffer.from(p.data, 'utf8');
    const method = p.method ?? 8;
    const body = method === 8 ? zlib.deflateRawSync(raw) : raw;
    const name = Buffer.from(p.name, 'utf8');
    const crc = zlib.crc32(raw);
    const stated = p.statedBytes ?? raw.length;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(p.flags ?? 0, 6);
    local.writeUInt16LE(method, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(body.length, 18);
    local.writeUInt32LE(stated, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(p.flags ?? 0, 8);
    central.writeUInt16LE(method, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(body.length, 20);
    central.writeUInt32LE(stated, 24);
    central.writeUInt16LE(name.length, 28);
    const shared = options.shareFirstEntryData && k > 0;
    central.writeUInt32LE(shared ? firstOffset : offset, 42);
    centrals.push(Buffer.concat([central, name]));
    if (k === 0) firstOffset = offset;
    if (!shared) {
      locals.push(local, name, body);
      offset += 30 + name.length + body.length;
    }
  });
  const dir = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(parts.length, 8);
  end.writeUInt16LE(parts.length, 10);
  end.writeUInt32LE(dir.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, dir, end]);
}
