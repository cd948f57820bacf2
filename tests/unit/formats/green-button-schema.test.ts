import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { validateXML } from 'xmllint-wasm';

// Source: NAESB REQ.21 ESPI schemas (espi.xsd 4.0.20231213, usage.xsd 3.3.20200320) and the
// Green Button atom.xsd, Apache 2.0, copied in tests/fixtures/schemas/espi/ with their licence;
// atom.xsd's network import points at the local stub (see tests/fixtures/schemas/README.md).
const dir = fileURLToPath(new URL('../../fixtures/schemas/', import.meta.url));
const read = (name: string): string => readFileSync(`${dir}${name}`, 'utf8');
const example = read('greenbutton-dmd-example.xml');

async function validate(xml: string, schema: 'espi/espi.xsd' | 'espi/usage.xsd') {
  return validateXML({
    xml: { fileName: 'feed.xml', contents: xml },
    schema: { fileName: schema, contents: read(schema) },
    preload: [
      { fileName: 'espi/atom.xsd', contents: read('espi/atom.xsd') },
      { fileName: 'xml-namespace-stub.xsd', contents: read('xml-namespace-stub.xsd') },
    ],
  });
}

describe('the sample Green Button feed against the official ESPI schema', () => {
  it('validates against espi.xsd (ESPI 4.0)', async () => {
    const result = await validate(example, 'espi/espi.xsd');
    expect(result.errors).toEqual([]);
    expect(result.valid).toBe(true);
  });

  it('validates against usage.xsd (ESPI 3.3)', async () => {
    const result = await validate(example, 'espi/usage.xsd');
    expect(result.valid).toBe(true);
  });

  it('fails when a reading value is not an integer (Int48)', async () => {
    const mutated = example.replace('<value>412345</value>', '<value>412.345</value>');
    expect(mutated).not.toBe(example);
    const result = await validate(mutated, 'espi/espi.xsd');
    expect(result.valid).toBe(false);
    expect(result.errors.map((e) => e.message).join('\n')).toMatch(/value/);
  });

  it('fails when DateTimeInterval children are out of schema order (start before duration)', async () => {
    const mutated = example.replace(
      '<interval>\n          <duration>259200</duration>\n          <start>1735711200</start>\n        </interval>',
      '<interval>\n          <start>1735711200</start>\n          <duration>259200</duration>\n        </interval>',
    );
    expect(mutated).not.toBe(example);
    expect((await validate(mutated, 'espi/espi.xsd')).valid).toBe(false);
  });
});
