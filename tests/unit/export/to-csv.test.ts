import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { ExportColumn } from '../../../src/lib/export/columns';
import { FORMULA_TRIGGERS, neutralizeText } from '../../../src/lib/export/neutralize';
import { toCsv, UTF8_BOM } from '../../../src/lib/export/to-csv';

interface Row {
  name: string | null;
  kbtu: number | null;
  billed: string | Date | null;
}
const columns: ExportColumn<Row>[] = [
  { key: 'name', header: 'Building', type: 'text' },
  { key: 'kbtu', header: 'kBtu', type: 'number' },
  { key: 'billed', header: 'Billed', type: 'date' },
];
const parse = (csv: string) => Papa.parse<string[]>(csv, { header: false }).data;

describe('OWASP CSV injection: text cells', () => {
  // Source: OWASP "CSV Injection": no cell may begin with = + - @ tab (0x09) or CR (0x0D);
  // the newer page adds LF (0x0A); OWASP ASVS 5.0 1.2.10 adds NUL.
  it.each([
    ['=', '=SUM(A1:A9)'],
    ['+', '+1+cmd|"/C calc"!A0'],
    ['-', '-2+3'],
    ['@', '@SUM(1,1)'],
    ['tab', '\t=1+1'],
    ['CR', '\r=1+1'],
    ['LF', '\n=1+1'],
    ['NUL', '\0=1+1'],
  ])('neutralizes a text cell starting with %s', (_label, text) => {
    const [, row] = parse(toCsv(columns, [{ name: text, kbtu: 1, billed: null }]));
    expect(row![0]).toBe(`'${text}`);
  });

  it('covers every listed trigger', () => {
    expect([...FORMULA_TRIGGERS].sort()).toEqual(
      ['\0', '\t', '\n', '\r', '+', '-', '=', '@'].sort(),
    );
  });

  it("reproduces OWASP's two escaping examples exactly", () => {
    // Source: OWASP "CSV Injection" examples: =1+2";=1+2 → "'=1+2"";=1+2"
    //                                          =1+2'" ;,=1+2 → "'=1+2'"" ;,=1+2"
    const one: ExportColumn<{ t: string }>[] = [{ key: 't', header: 'T', type: 'text' }];
    expect(toCsv(one, [{ t: '=1+2";=1+2' }]).split('\r\n')[1]).toBe(`"'=1+2"";=1+2"`);
    expect(toCsv(one, [{ t: `=1+2'" ;,=1+2` }]).split('\r\n')[1]).toBe(`"'=1+2'"" ;,=1+2"`);
  });

  it('leaves ordinary text alone and neutralizes headers too', () => {
    expect(neutralizeText('Bldg 12 = old')).toBe('Bldg 12 = old');
    const csv = toCsv(
      [{ key: 'name', header: '=HEADER', type: 'text' }] as ExportColumn<Row>[],
      [],
    );
    expect(csv).toBe(`"'=HEADER"`);
  });

  it('treats a number in a text column as text: "-5" gets the quote', () => {
    const one: ExportColumn<{ t: unknown }>[] = [{ key: 't', header: 'T', type: 'text' }];
    expect(parse(toCsv(one, [{ t: -5 }]))[1]![0]).toBe("'-5");
  });

  it('never lets a string through a number column unneutralized', () => {
    const one: ExportColumn<{ n: unknown }>[] = [{ key: 'n', header: 'N', type: 'number' }];
    expect(parse(toCsv(one, [{ n: '=1+1' }]))[1]![0]).toBe("'=1+1");
  });
});

describe('numbers stay numbers', () => {
  it('writes negative numbers plain, unquoted and unprefixed', () => {
    // Source: OWASP guidance applies to text cells; numeric cells are typed (security notes A2)
    const csv = toCsv(columns, [{ name: 'Credit', kbtu: -1234.5, billed: null }]);
    expect(csv.split('\r\n')[1]).toBe('"Credit",-1234.5,');
    expect(Number(parse(csv)[1]![1])).toBe(-1234.5);
  });

  it('writes NaN and Infinity as empty cells', () => {
    const csv = toCsv(columns, [
      { name: 'a', kbtu: Number.NaN, billed: null },
      { name: 'b', kbtu: Infinity, billed: null },
    ]);
    expect(
      parse(csv)
        .slice(1)
        .map((r) => r[1]),
    ).toEqual(['', '']);
  });

  it('round-trips any finite double through papaparse (property)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const back = parse(toCsv(columns, [{ name: 'x', kbtu: x, billed: null }]))[1]![1]!;
        expect(back.startsWith("'")).toBe(false);
        expect(Number(back)).toBe(x === 0 ? 0 : x); // -0 is written as 0
      }),
    );
  });
});

describe('RFC 4180 quoting', () => {
  it('quotes fields with quotes, commas and line breaks and doubles the quotes', () => {
    // Source: RFC 4180 §2.6 (fields with CRLF, double quotes or commas are enclosed in quotes),
    // §2.7 (a double quote inside is escaped by another double quote): b"bb → "b""bb"
    const csv = toCsv(columns, [{ name: 'b"bb', kbtu: 1, billed: null }]);
    expect(csv.split('\r\n')[1]).toBe('"b""bb",1,');
    const multi = toCsv(columns, [{ name: 'line 1\r\nline 2, more', kbtu: 2, billed: null }]);
    expect(parse(multi)[1]![0]).toBe('line 1\r\nline 2, more');
  });

  it('ends records with CRLF (RFC 4180 §2.1)', () => {
    const csv = toCsv(columns, [
      { name: 'a', kbtu: 1, billed: null },
      { name: 'b', kbtu: 2, billed: null },
    ]);
    expect(csv).toBe('"Building",kBtu,Billed\r\n"a",1,\r\n"b",2,');
  });

  it('round-trips any text through papaparse.parse as its neutralized form (property)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), fc.string(), (a, b) => {
        const rows: Row[] = [
          { name: a, kbtu: 1, billed: null },
          { name: b, kbtu: -2, billed: null },
        ];
        const back = parse(toCsv(columns, rows));
        expect(back).toHaveLength(3);
        expect(back[1]![0]).toBe(neutralizeText(a));
        expect(back[2]![0]).toBe(neutralizeText(b));
        expect(back[2]![1]).toBe('-2');
      }),
      { numRuns: 300 },
    );
  });
});

describe('dates and options', () => {
  it('writes dates as ISO 8601 calendar dates (UTC)', () => {
    const csv = toCsv(columns, [
      { name: 'a', kbtu: 1, billed: '2024-02-29' },
      { name: 'b', kbtu: 1, billed: new Date(Date.UTC(2024, 0, 2, 23, 0)) },
      { name: 'c', kbtu: 1, billed: '2023-02-30' }, // impossible date: kept as text
    ]);
    expect(
      parse(csv)
        .slice(1)
        .map((r) => r[2]),
    ).toEqual(['2024-02-29', '2024-01-02', '2023-02-30']);
  });

  it('writes null as an empty field and adds a BOM only when asked', () => {
    const csv = toCsv(columns, [{ name: null, kbtu: null, billed: null }], { bom: true });
    expect(csv.startsWith(UTF8_BOM)).toBe(true);
    expect(csv.slice(1).split('\r\n')[1]).toBe('"",,');
    expect(toCsv(columns, []).startsWith(UTF8_BOM)).toBe(false);
  });
});
