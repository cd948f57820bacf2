/**
 * Client for NOAA's NCEI Access Data Service, daily summaries (GHCN-Daily): WEATHER_SERVICE_URL
 * (the full endpoint, e.g. https://www.ncei.noaa.gov/access/services/data/v1), or the local fake
 * when it is unset. Always sends `units`: without it the service answers in tenths of °C.
 */
import { parseWeatherJson, type WeatherDay } from '../../lib/formats';
import type { RowProblem } from '../../lib/formats';
import { ensureFakeWeatherService } from './fake-service';

export interface FetchedDays {
  ok: true;
  days: WeatherDay[];
  problems: RowProblem[];
  source: string;
}
export interface FetchFailure {
  ok: false;
  message: string;
}

export async function serviceUrl(): Promise<{ url: string; fake: boolean }> {
  const configured = process.env.WEATHER_SERVICE_URL;
  return configured ? { url: configured, fake: false } : { url: await ensureFakeWeatherService(), fake: true };
}

/** Daily Tmax/Tmin of one station over [startDate, endDate] (ISO dates), in °F. */
export async function fetchDailySummaries(stationId: string, startDate: string, endDate: string): Promise<FetchedDays | FetchFailure> {
  const { url, fake } = await serviceUrl();
  const q = new URL(url);
  q.searchParams.set('dataset', 'daily-summaries');
  q.searchParams.set('stations', stationId);
  q.searchParams.set('startDate', startDate);
  q.searchParams.set('endDate', endDate);
  q.searchParams.set('dataTypes', 'TMAX,TMIN');
  q.searchParams.set('units', 'standard');
  q.searchParams.set('format', 'json');
  let res: Response;
  try {
    res = await fetch(q, { signal: AbortSignal.timeout(60_000), headers: { accept: 'application/json' } });
  } catch (e) {
    return { ok: false, message: `The weather service at ${q.origin} did not answer (${(e as Error).message}).` };
  }
  const text = await res.text();
  if (!res.ok) return { ok: false, message: `The weather service answered ${res.status}: ${text.slice(0, 300)}` };
  const parsed = parseWeatherJson(text, { units: 'standard', station: stationId });
  if (!parsed.ok) return { ok: false, message: parsed.message };
  return { ok: true, days: parsed.days, problems: parsed.problems, source: fake ? 'local stand-in service' : q.origin };
}
