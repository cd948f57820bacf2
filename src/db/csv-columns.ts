/**
 * Splits CSV text written by our own import code (RFC 4180 quoting, no header) back into column
 * arrays; an empty unquoted field is NULL, as COPY … (format csv) reads it.
 */
export function parseCsvColumns(csv: string, width: number): (string | null)[][] {
  const cols: (string | null)[][] = Array.from({ length: width }, () => []);
  let i = 0;
  let col = 0;
  const n = csv.length;
  while (i < n) {
    let value: string | null;
    if (csv[i] === '"') {
      let out = '';
      i++;
      for (;;) {
        const q = csv.indexOf('"', i);
        if (q < 0) throw new Error('unterminated quote');
        out += csv.slice(i, q);
        if (csv[q + 1] === '"') {
          out += '"';
          i = q + 2;
        } else {
          i = q + 1;
          break;
        }
      }
      value = out;
    } else {
      let j = i;
      while (j < n && csv[j] !== ',' && csv[j] !== '\n') j++;
      value = j === i ? null : csv.slice(i, j);
      i = j;
    }
    cols[col]!.push(value);
    if (csv[i] === ',') {
      col++;
      i++;
    } else {
      if (col !== width - 1) throw new Error(`row has ${col + 1} fields, expected ${width}`);
      col = 0;
      if (csv[i] === '\n') i++;
    }
  }
  return cols;
}
