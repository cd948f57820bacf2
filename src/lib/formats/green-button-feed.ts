/**
 * Reads a Green Button (NAESB REQ.21 ESPI) Atom feed into its entries and the links between
 * them, safely: no DTD is processed (a document with a DOCTYPE or ENTITY declaration is refused,
 * so no entity can expand), the XML is checked for well-formedness first, and namespace prefixes
 * are dropped (`espi:`, `atom:` or default namespaces all read the same).
 *
 * Structure (RFC 4287 Atom; ESPI resources in namespace http://naesb.org/espi): a `feed` holds
 * `entry` elements; each entry has `link rel="self|up|related"` and a `content` holding one ESPI
 * resource (UsagePoint, MeterReading, ReadingType, IntervalBlock, UsageSummary,
 * LocalTimeParameters...). The resource tree is expressed by links, not nesting: a child entry
 * belongs to a parent when its `self` or `up` href is one of the parent's `related` hrefs.
 * Source: NAESB REQ.21 ESPI v4.0 schema (espi.xsd 4.0.20231213) and Green Button Alliance
 * developer documentation, as summarized in the project's data-standards notes §1.2.
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { type FileFailure, fileFailure } from './problems';

export type XmlNode = Record<string, unknown>;

export interface EspiEntry {
  /** Local name of the resource element inside `content` (UsagePoint, ReadingType...). */
  kind: string;
  /** The resource element (the first, when `content` repeats it). */
  resource: XmlNode;
  /** Every element of that kind in `content` (an IntervalBlock entry may hold several). */
  resources: XmlNode[];
  title: string;
  self: string | null;
  up: string | null;
  related: string[];
}

const ARRAY_TAGS = new Set(['entry', 'link', 'IntervalBlock', 'IntervalReading', 'ReadingQuality', 'costAdditionalDetailLastPeriod']);

const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  removeNSPrefix: true,
  parseTagValue: false,
  parseAttributeValue: false,
  trimValues: true,
  ignoreDeclaration: true,
  ignorePiTags: true,
  processEntities: true, // only the five predefined XML entities: DTDs are refused before parsing
  isArray: (name) => ARRAY_TAGS.has(name),
});

export function isNode(value: unknown): value is XmlNode {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Text of a leaf element (`<a>1</a>` or `<a type="x">1</a>`), or null. */
export function text(value: unknown): string | null {
  if (typeof value === 'string') return value;
  if (isNode(value) && typeof value['#text'] === 'string') return value['#text'];
  return null;
}

export function child(node: XmlNode, name: string): XmlNode | null {
  const v = node[name];
  return isNode(v) ? v : null;
}

export function children(node: XmlNode, name: string): XmlNode[] {
  const v = node[name];
  return Array.isArray(v) ? v.filter(isNode) : isNode(v) ? [v] : [];
}

/** An integer leaf (ESPI Int48, UInt32, TimeType...), or null when absent or not an integer. */
export function integer(node: XmlNode | null, name: string): number | null {
  if (node === null) return null;
  const t = text(node[name]);
  if (t === null || !/^[+-]?\d{1,16}$/.test(t)) return null;
  const n = Number(t);
  return Number.isSafeInteger(n) ? n : null;
}

/** Hrefs compare by path: `https://host/espi/...` and `/espi/...` name the same resource. */
export function normalizeHref(href: string): string {
  const scheme = href.indexOf('://');
  const path = scheme >= 0 ? href.slice(href.indexOf('/', scheme + 3) >>> 0) : href;
  return path.endsWith('/') ? path.slice(0, -1) : path;
}

function readEntry(entry: XmlNode): EspiEntry | null {
  const content = child(entry, 'content');
  if (content === null) return null;
  const kind = Object.keys(content).find((k) => !k.startsWith('@_') && k !== '#text');
  if (kind === undefined) return null;
  const value = content[kind];
  const resources = Array.isArray(value) ? value.filter(isNode) : isNode(value) ? [value] : [{}];
  const links = children(entry, 'link');
  const href = (rel: string): string[] =>
    links.filter((l) => l['@_rel'] === rel && typeof l['@_href'] === 'string').map((l) => normalizeHref(String(l['@_href'])));
  return {
    kind,
    resource: resources[0] ?? {},
    resources,
    title: text(entry['title']) ?? '',
    self: href('self')[0] ?? null,
    up: href('up')[0] ?? null,
    related: href('related'),
  };
}

/** Characters outside XML 1.0's `Char` production (W3C XML 1.0 5th ed. §2.2): C0 controls other than tab, LF, CR, and U+FFFE/U+FFFF. */
const NOT_XML_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/;

/**
 * Parses the feed text into ESPI entries.
 * @example readEspiFeed(xml) // { ok: true, entries: [{ kind: 'UsagePoint', ... }, ...] }
 */
export function readEspiFeed(xml: string): { ok: true; entries: EspiEntry[] } | FileFailure {
  const body = xml.charCodeAt(0) === 0xfeff ? xml.slice(1) : xml;
  if (body.trim() === '') return fileFailure('empty-file', 'The file is empty.');
  if (/<!DOCTYPE|<!ENTITY/i.test(body)) {
    return fileFailure('dtd-not-allowed', 'The XML declares a DOCTYPE or entities; Green Button files have none, so it is refused for safety.');
  }
  const bad = NOT_XML_CHAR.exec(body);
  if (bad !== null) {
    const before = body.slice(0, bad.index);
    const line = before.split('\n').length;
    const column = bad.index - before.lastIndexOf('\n');
    const code = `U+${bad[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`;
    return fileFailure('malformed-xml', `The file is not well-formed XML: it contains the control character ${code}, which XML does not allow (line ${line}, column ${column}).`);
  }
  const valid = XMLValidator.validate(body);
  if (valid !== true) {
    return fileFailure('malformed-xml', `The file is not well-formed XML: ${valid.err.msg} (line ${valid.err.line}, column ${valid.err.col}).`);
  }
  let doc: unknown;
  try {
    doc = parser.parse(body);
  } catch (error) {
    return fileFailure('malformed-xml', `The file could not be read as XML: ${error instanceof Error ? error.message : String(error)}.`);
  }
  if (!isNode(doc)) return fileFailure('not-green-button', 'The file is not a Green Button feed.');
  const feed = child(doc, 'feed');
  const rawEntries = feed !== null ? children(feed, 'entry') : children(doc, 'entry');
  if (feed === null && rawEntries.length === 0) {
    return fileFailure('not-green-button', 'The XML is not a Green Button (ESPI Atom) feed: it has no <feed> or <entry> element.');
  }
  const entries = rawEntries.map(readEntry).filter((e): e is EspiEntry => e !== null);
  return { ok: true, entries };
}

/** Entries of `kind` that the parent links to (by self or up href), or that sit under its path. */
export function linkedEntries(parent: EspiEntry, entries: readonly EspiEntry[], kind: string): EspiEntry[] {
  const related = new Set(parent.related);
  const prefix = parent.self === null ? null : `${parent.self}/`;
  return entries.filter(
    (e) =>
      e.kind === kind &&
      ((e.self !== null && related.has(e.self)) ||
        (e.up !== null && related.has(e.up)) ||
        (prefix !== null && e.self !== null && e.self.startsWith(prefix))),
  );
}
