const files: { table: string; what: string }[] = [
  { table: 'plots', what: 'One row per bed: treatment, area, setting, mulch, lid, pots, crop, planting date.' },
  { table: 'water-events', what: 'One row per pot refill or surface watering.' },
  { table: 'moisture-readings', what: 'One row per soil moisture reading; each method on its own scale.' },
  { table: 'harvests', what: 'One row per pick.' },
  { table: 'weather-days', what: 'One row per garden and day of weather.' },
  { table: 'data-dictionary', what: 'What every column of the other files means, with its unit.' },
];

/** Download links for every cohort CSV: pseudonymised, the same data the pooled results use. */
export function ExportLinks({ cohortId }: { cohortId: string }) {
  return (
    <div className="space-y-3">
      <p className="max-w-3xl text-sm text-ink-muted">
        Tidy CSV files, one row per observation, ISO 8601 dates and SI units in the column names. Trials appear by a code and the member’s pseudonym, never by
        name; locations are not included. Trials the lead left out are still in the files, so a report can say what was left out and why.
      </p>
      <a
        className="inline-flex min-h-11 items-center rounded-lg bg-terracotta-600 px-4 font-medium text-white hover:bg-terracotta-700"
        href={`/api/cohorts/${encodeURIComponent(cohortId)}/report.zip`}
        download
      >
        Report bundle (ZIP): all the files below, every chart as SVG and PNG, and a methods-and-results text with the licence
      </a>
      <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
        {files.map((f) => (
          <li key={f.table} className="rounded-lg border border-sand-200 bg-white p-3">
            <a
              className="inline-flex min-h-10 items-center font-medium text-terracotta-700 underline"
              href={`/api/cohorts/${encodeURIComponent(cohortId)}/export/${f.table}.csv`}
              download
            >
              {f.table}.csv
            </a>
            <p className="text-sm text-ink-muted">{f.what}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
