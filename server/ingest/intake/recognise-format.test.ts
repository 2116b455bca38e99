import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { recogniseFormat } from './recognise-format';

const root = path.resolve(import.meta.dirname, '../../..');

describe('recogniseFormat', () => {
  it('When the file starts with GRIB and edition 2, then it is GRIB2 (ecCodes sample regular_ll_pl_grib2.tmpl)', () => {
    expect(recogniseFormat(readFileSync('/usr/share/eccodes/samples/regular_ll_pl_grib2.tmpl'))).toEqual({ format: 'grib2' });
  });

  it('When the file is GRIB edition 1, then it is refused with the edition named (ecCodes sample GRIB1.tmpl)', () => {
    expect(recogniseFormat(readFileSync('/usr/share/eccodes/samples/GRIB1.tmpl'))).toEqual({ format: 'unknown', reason: 'GRIB edition 1 is not taken; only GRIB edition 2 model fields are.' });
  });

  it('When the file starts with BUFR, or has a bulletin heading before it, then it is BUFR', () => {
    const bufr = readFileSync(path.join(root, 'tests/fixtures/bufr/three-stations.bufr'));
    expect(recogniseFormat(bufr).format).toBe('bufr');
    expect(recogniseFormat(Buffer.concat([Buffer.from('IUSD01 KWBC 181200\r\r\n'), bufr])).format).toBe('bufr');
  });

  it('When the file is our sounding CSV (with or without metadata lines), then it is CSV', () => {
    expect(recogniseFormat(readFileSync(path.join(root, 'tests/fixtures/soundings/oax_20140616_19z.csv'))).format).toBe('csv');
    expect(recogniseFormat(Buffer.from('temperature_C,pressure_hPa\n20,1000\n')).format).toBe('csv');
  });

  it('When the file is other text or other binary, then it is unknown with a reason', () => {
    expect(recogniseFormat(Buffer.from('hello,world\n1,2\n'))).toMatchObject({ format: 'unknown' });
    expect(recogniseFormat(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0]))).toMatchObject({ format: 'unknown' });
  });
});
