/**
 * A local stand-in for NOAA's NCEI Access Data Service (`/access/services/data/v1`,
 * `dataset=daily-summaries`), for development and tests: no network, deterministic data.
 * It answers the same parameters in the same shapes (JSON or CSV; `units=standard` in °F,
 * `metric` in °C, and without `units` the stored GHCN values in tenths of °C) with temperatures
 * generated from the station id: a seasonal curve, day-to-day variation, and a missing day now
 * and then. Invented data, never presented as observations.
 */
import { createServer, type Server } from 'node:http';
import { dayFromIso, isoFromDay } from '../../lib/weather/day-number';

export const SERVICE_PATH = '/access/services/data/v1';

function hash(s: string): number {
  let h = 2166136261;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 16777619);
  return h >>> 0;
}

function unit01(seed: number): number {
  let x = seed | 0;
  x = Math.imul(x ^ (x >>> 16), 0x45d9f3b);
  x = Math.imul(x ^ (x >>> 16), 0x45d9f3b);
  return ((x ^ (x >>> 16)) >>> 0) / 4294967296;
}

/** The fake's daily Tmax/Tmin in °F for a station and day, or null for a missing day. */
export function fakeDay(station: string, day: number): { tmaxF: number; tminF: number } | null {
  const h = hash(station);
  if (unit01(h ^ (day * 2654435761)) < 0.004) return null; // about 1.5 missing days a year
  const mean = 45 + (h % 25); // annual mean 45-69 °F
  const swing = 12 + ((h >>> 8) % 16); // half the seasonal range, 12-27 °F
  const doy = (((day + 4) % 365.2425) + 365.2425) % 365.2425;
  const seasonal = mean - swing * Math.cos((2 * Math.PI * (doy - 15)) / 365.2425);
  const weather = (unit01(h + day * 7919) - 0.5) * 14;
  const range = 14 + unit01(h ^ (day * 104729)) * 10;
  const t = seasonal + weather;
  return { tmaxF: Math.round(t + range / 2), tminF: Math.round(t - range / 2) };
}

const fToC = (f: number) => ((f - 32) * 5) / 9;

function answer(url: URL): { status: number; type: string; body: string } {
  const p = url.searchParams;
  const bad = (message: string) => ({ status: 400, type: 'application/json', body: JSON.stringify({ errorMessage: message, errorCode: 400 }) });
  if (url.pathname !== SERVICE_PATH) return { status: 404, type: 'text/plain', body: 'not found' };
  if (p.get('dataset') !== 'daily-summaries') return bad('dataset: only daily-summaries is served here');
  const stations = (p.get('stations') ?? '').split(',').filter(Boolean);
  if (stations.length === 0) return bad('stations: required');
  const start = dayFromIso(p.get('startDate') ?? '');
  const end = dayFromIso(p.get('endDate') ?? '');
  if (start === null || end === null || end < start) return bad('startDate and endDate: ISO dates, start before end');
  if (end - start > 366 * 50) return bad('the date range is too long');
  const units = p.get('units');
  if (units !== null && units !== 'standard' && units !== 'metric') return bad('units: standard or metric');
  const types = (p.get('dataTypes') ?? 'TMAX,TMIN').split(',');
  const format = p.get('format') ?? 'csv';
  const value = (f: number): string => (units === 'standard' ? String(f) : units === 'metric' ? fToC(f).toFixed(1) : String(Math.round(fToC(f) * 10)).padStart(5));
  const records: Record<string, string>[] = [];
  for (const station of stations)
    for (let d = start; d <= end; d++) {
      const t = fakeDay(station, d);
      const r: Record<string, string> = { DATE: isoFromDay(d), STATION: station };
      if (t && types.includes('TMAX')) r.TMAX = value(t.tmaxF);
      if (t && types.includes('TMIN')) r.TMIN = value(t.tminF);
      records.push(r);
    }
  if (format === 'json') return { status: 200, type: 'application/json', body: JSON.stringify(records) };
  const cols = ['STATION', 'DATE', ...types.filter((t) => t === 'TMAX' || t === 'TMIN')];
  const lines = [cols.map((c) => `"${c}"`).join(','), ...records.map((r) => cols.map((c) => `"${r[c] ?? ''}"`).join(','))];
  return { status: 200, type: 'text/csv', body: lines.join('\n') + '\n' };
}

const KEY = Symbol.for('plumbline.weather-fake');
type Holder = typeof globalThis & { [KEY]?: Promise<{ url: string; server: Server }> };
const holder = globalThis as Holder;

/** Starts the fake on a loopback port (once per process); returns its service URL. */
export async function ensureFakeWeatherService(): Promise<string> {
  holder[KEY] ??= new Promise((resolve, reject) => {
    const server = createServer((req, res) => {
      const r = answer(new URL(req.url ?? '/', 'http://localhost'));
      res.writeHead(r.status, { 'content-type': r.type });
      res.end(r.body);
    });
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const a = server.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      server.unref();
      resolve({ url: `http://127.0.0.1:${port}${SERVICE_PATH}`, server });
    });
  });
  return (await holder[KEY]).url;
}
