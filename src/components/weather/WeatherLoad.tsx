/** Load daily temperatures into a station: from the weather service for a date range, or from a file. */
import { useState } from 'react';
import { formatNumber } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { ProblemTable, type Problem } from '../intake/ProblemTable';
import { uploadForm } from '../intake/upload';

interface LoadReport {
  counts: { rows: number; new: number; changed: number; unchanged: number; rejected: number };
  problems: Problem[];
  source: string;
}

export default function WeatherLoad({ station, serviceId, defaultStart, defaultEnd }: { station: string; serviceId: string | null; defaultStart: string; defaultEnd: string }) {
  const [start, setStart] = useState(defaultStart);
  const [end, setEnd] = useState(defaultEnd);
  const [file, setFile] = useState<File | null>(null);
  const [units, setUnits] = useState<'standard' | 'metric'>('standard');
  const [busy, setBusy] = useState(false);
  const [report, setReport] = useState<LoadReport | null>(null);
  const [error, setError] = useState<string | null>(null);

  const run = async (f: () => Promise<LoadReport>) => {
    setBusy(true);
    setError(null);
    setReport(null);
    try {
      setReport(await f());
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <section className="card space-y-4" aria-labelledby="load-weather">
      <h2 id="load-weather">Load temperatures</h2>
      <div className="grid gap-6 lg:grid-cols-2">
        <div className="space-y-3">
          <h3 className="font-medium">From the weather service</h3>
          {serviceId ? (
            <>
              <div className="flex flex-wrap items-end gap-2">
                <div><label htmlFor="wx-start" className="field-label">From</label><input id="wx-start" type="date" className="field-input" value={start} onChange={(e) => setStart(e.target.value)} /></div>
                <div><label htmlFor="wx-end" className="field-label">To</label><input id="wx-end" type="date" className="field-input" value={end} onChange={(e) => setEnd(e.target.value)} /></div>
                <button type="button" className="btn-primary" disabled={busy} onClick={() => void run(() => api<LoadReport>(`/api/weather/stations/${station}/fetch`, { method: 'POST', body: { start, end } }))}>Fetch</button>
              </div>
              <p className="field-hint">Daily Tmax and Tmin of station <span className="figure">{serviceId}</span> (GHCN-Daily), in °F.</p>
            </>
          ) : (
            <p className="text-sm text-ink-600">This station has no weather-service id.</p>
          )}
        </div>
        <div className="space-y-3">
          <h3 className="font-medium">From a file</h3>
          <div>
            <label htmlFor="wx-file" className="field-label">Daily-summaries CSV (STATION, DATE, TMAX, TMIN)</label>
            <input id="wx-file" type="file" accept=".csv,text/csv" className="field-input" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
          </div>
          <fieldset className="flex gap-4 text-sm">
            <legend className="field-label">Temperatures are in</legend>
            <label className="flex items-center gap-1.5"><input type="radio" name="wx-units" checked={units === 'standard'} onChange={() => setUnits('standard')} /> °F</label>
            <label className="flex items-center gap-1.5"><input type="radio" name="wx-units" checked={units === 'metric'} onChange={() => setUnits('metric')} /> °C</label>
          </fieldset>
          <button type="button" className="btn-primary" disabled={busy || !file} onClick={() => void run(() => {
            const form = new FormData();
            form.set('file', file!);
            form.set('units', units);
            return uploadForm<LoadReport>(`/api/weather/stations/${station}/observations`, form, null, () => undefined);
          })}>Load file</button>
        </div>
      </div>
      {busy && <p role="status">Loading…</p>}
      {error && <p className="notice-error" role="alert">{error}</p>}
      {report && (
        <div className="space-y-2" role="status">
          <p className="notice-info">
            {formatNumber(report.counts.new)} days added, {formatNumber(report.counts.changed)} changed, {formatNumber(report.counts.unchanged)} unchanged, {formatNumber(report.counts.rejected)} refused ({report.source}). Reload the page to see the coverage.
          </p>
          {report.problems.length > 0 && <ProblemTable problems={report.problems} />}
        </div>
      )}
    </section>
  );
}
