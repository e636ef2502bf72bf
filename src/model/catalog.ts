/**
 * The catalog model the templates place, as types only: every part's page
 * (datasheet and test report), the comparison pages, the failures, the site's
 * settings. The pipeline builds it (pipeline/catalog.ts, comparison-page.ts);
 * the site, the PDFs, the archive and the CLI read it. It imports nothing
 * above itself, so the site layer never reaches up into the pipeline.
 */
import type { Cell } from '../format/values.js';
import type { SiteSettings } from '../site-file/settings.js';

export interface ComplianceRow {
  readonly label: string;
  readonly figure: string;
  readonly on: string;
  readonly band: string;
  readonly bandRange: string;
  readonly limit: string;
  readonly typical: Cell;
  readonly worst: Cell;
  readonly worstUnit: string;
  readonly at: Cell;
  readonly margin: Cell;
  readonly verdict: 'PASS' | 'FAIL' | 'REPORT';
  /** A change limit's two stages, "stage: initial → stage: after shock"; '' for every other row. */
  readonly stages: string;
  readonly units: ReadonlyArray<{
    readonly unit: string;
    readonly worst: Cell;
    readonly at: Cell;
    readonly margin: Cell;
    readonly verdict: 'PASS' | 'FAIL' | 'REPORT';
  }>;
}

export interface MeasurementRow {
  readonly unit: string;
  readonly conditions: string;
  readonly file: string;
  readonly sha256: string;
  readonly points: number;
  readonly range: string;
  readonly reference: string;
  readonly touchstone: string;
  readonly notes: string;
  /** Measurement metadata from the part file ('' where not given). */
  readonly instrument: string;
  readonly calibration: string;
  readonly measuredOn: string;
  readonly operator: string;
  /** The file's own comment and [Begin Information] lines (the first 12). */
  readonly fileLines: readonly string[];
}

export interface LotRow {
  readonly label: string;
  readonly on: string;
  readonly band: string;
  readonly stages: string;
  /** Distinct units. */
  readonly units: number;
  readonly groups: ReadonlyArray<{
    readonly label: string;
    readonly count: number;
    readonly mean: string;
    readonly std: string;
    readonly min: string;
    readonly max: string;
    readonly cpk: string;
    readonly worst: string;
  }>;
  /** Per condition: the largest minus the smallest of the conditions' worsts, or ''. */
  readonly conditionSpread: string;
  readonly strip: string;
}

export interface QualityRow {
  readonly unit: string;
  readonly passivity: string;
  readonly reciprocity: string;
  readonly ieee370: string;
  /** A warning for the reader, or null when the data look as the class expects. */
  readonly flag: string | null;
}

export interface PartPage {
  readonly slug: string;
  readonly url: string;
  readonly pdfUrl: string | null;
  /** The test report page (QA-facing), its PDF; null when site.yaml keeps reports out. */
  readonly reportUrl: string | null;
  readonly reportPdfUrl: string | null;
  readonly part: string;
  readonly title: string;
  readonly partClass: string;
  readonly revision: string;
  readonly date: string;
  readonly vendor: string;
  readonly description: string;
  readonly notesHtml: string;
  readonly packageText: string;
  readonly connector: string;
  readonly operatingTemperature: string;
  readonly ports: ReadonlyArray<{ readonly number: number; readonly name: string }>;
  readonly pass: boolean;
  readonly frequencyRange: string;
  /** The band the part is specified for (operating-band, or the band of the class's main transmission limit), as text; '' when it has no limits. */
  readonly operatingBand: string;
  readonly features: readonly string[];
  readonly weight: string;
  /** The outline drawing's path in the site (under assets/), or ''. */
  readonly outline: string;
  readonly ordering: ReadonlyArray<{ readonly code: string; readonly description: string }>;
  /** The published measurement files: where they come from (relative to the content folder) and their path in the site. */
  readonly dataFiles: ReadonlyArray<{ readonly unit: string; readonly from: string; readonly url: string; readonly name: string }>;
  /** Distinct units measured (a unit at three temperatures counts once). */
  readonly unitCount: number;
  readonly specification: readonly SpecGroup[];
  /** The conditions typical values are quoted at (typical-at), as text, or ''. */
  readonly typicalConditions: string;
  /** The closing disclaimer: the vendor's, or one composed from how the limits are assured. */
  readonly disclaimer: string;
  readonly compliance: readonly ComplianceRow[];
  readonly plots: readonly PlotBlock[];
  readonly measurements: readonly MeasurementRow[];
  readonly quality: readonly QualityRow[];
  /** Lot statistics per limit (the test report). */
  readonly lots: readonly LotRow[];
  readonly ratings: ReadonlyArray<{ readonly parameter: string; readonly value: string; readonly notes: string }>;
  readonly cautions: readonly string[];
  /**
   * Warnings, the measurement files' reader warnings first: where (FILE:LINE:COL, for the report and
   * the terminal), what, and whether a data file's reader gave it (the datasheet shows the others only).
   */
  readonly warnings: ReadonlyArray<{ readonly where: string; readonly message: string; readonly fromFile: boolean }>;
  /** The JSON of `scatterbook figures --json`, for machine readers and tests. */
  readonly figuresJson: string;
  /** Exports: the site paths of the part's figures as JSON and CSV and of the median Touchstone file (null: why there is none). */
  readonly exports: {
    readonly json: string;
    readonly csv: string;
    readonly median: { readonly url: string; readonly text: string; readonly file?: string } | null;
    readonly noMedian: string;
  };
  /** Releases and the current revision, oldest first (archive/releases.ts). */
  readonly history: readonly HistoryRow[];
  /** The released documents the site carries unchanged: where they are in the content folder, and their site path. */
  readonly releasedFiles: ReadonlyArray<{ readonly from: string; readonly url: string }>;
  /** What the page rests on, for the manifest: the part file and every measurement file, relative to the content folder, with their SHA-256. */
  readonly inputs: Inputs;
}

export interface Inputs {
  readonly spec: { readonly path: string; readonly sha256: string };
  readonly data: ReadonlyArray<{ readonly unit: string; readonly path: string; readonly sha256: string }>;
  /** The first 12 hex digits of the SHA-256 of the inputs (fingerprintOf): shown on the documents, it leads to their manifest entry. */
  readonly fingerprint: string;
}

export interface PartFailure {
  readonly slug: string;
  readonly file: string;
  readonly messages: readonly string[];
  /** A bug of scatterbook met while building the part, not a fault of its files (the build exits 4). */
  readonly internal?: boolean;
}

export interface Catalog {
  readonly site: SiteSettings;
  /** The scatterbook version that built it. */
  readonly version: string;
  readonly parts: readonly PartPage[];
  /** The parts whose test report is built (all, or none when site.yaml sets reports: false). */
  readonly reportParts: readonly PartPage[];
  readonly byClass: ReadonlyArray<{ readonly partClass: string; readonly title: string; readonly parts: readonly PartPage[] }>;
  readonly failures: readonly PartFailure[];
  /** The comparisons of candidate parts (content/comparisons/<slug>.yaml). */
  readonly comparisons: readonly ComparisonPage[];
  readonly generator: string;
  /** Cpk is shown from this many units up (archive/lot.ts). */
  readonly cpkMinUnits: number;
  /** The pages this run renders (all, in a build; none but the index when `merge` joins shards that rendered them). */
  readonly pages: { readonly parts: readonly PartPage[]; readonly reports: readonly PartPage[]; readonly comparisons: readonly ComparisonPage[] };
}

export interface PlotBlock {
  readonly id: string;
  /** 'smith' for a Smith chart, else a figure over frequency. */
  readonly kind: 'figure' | 'smith';
  readonly title: string;
  /** The SVG ('' when it waits in svgFile: pipeline/spill.ts). */
  readonly svg: string;
  readonly svgFile?: string;
  readonly legend: ReadonlyArray<{ readonly label: string; readonly color: string; readonly dash: string }>;
  /** Limits of one series, drawn as a thick line in its style. */
  readonly limitLegend: ReadonlyArray<{ readonly label: string; readonly color: string; readonly dash: string }>;
  /** Distinct units, and measurements (a unit at three temperatures counts three times). */
  readonly unitCount: number;
  readonly measurementCount: number;
  readonly hasLimits: boolean;
}

/** A row of the specification table: a figure over a band, with its limits and its typical value. */
export interface SpecRow {
  readonly label: string;
  readonly on: string;
  /** Band and conditions, e.g. "2.40 GHz to 2.50 GHz" or "10 MHz to 6 GHz, temperature 85 °C". */
  readonly conditions: string;
  /** Declared by the vendor, not computed from the measured files. */
  readonly declared: boolean;
  /** The index of the result the row shows, in figures --json's results (null for a declared row). */
  readonly result: number | null;
  readonly min: Cell;
  readonly typ: Cell;
  readonly max: Cell;
  readonly unit: string;
  /** The footnote mark of how the limit is assured ('' when it is checked on the listed units only). */
  readonly mark: string;
  /** Where typical comes from when that needs saying: "at temperature 25 °C", "over mixed conditions". */
  readonly typicalNote: string;
  /** One line for the catalog index: "Insertion loss 0.92 dB typ, ≤ 1.20 dB max". */
  readonly summary: string;
}

/** Rows of one band (or the vendor's declared specifications), under a heading. */
export interface SpecGroup {
  readonly title: string;
  readonly rows: readonly SpecRow[];
}

export interface HistoryRow {
  readonly revision: string;
  readonly date: string;
  /** The release's date (YYYY-MM-DD), or '' for the current revision when it is not released. */
  readonly released: string;
  readonly current: boolean;
  /** Its figures against the revision before it, in words. */
  readonly changes: readonly string[];
  readonly documents: ReadonlyArray<{ readonly name: string; readonly url: string }>;
}

export interface ComparisonCell {
  readonly text: string;
  /** The worst value (null without a result), for machine readers and tests. */
  readonly value: number | null;
  readonly margin: string;
  readonly verdict: 'PASS' | 'FAIL' | 'NO DATA';
  readonly best: boolean;
}

export interface ComparisonCandidate {
  readonly label: string;
  readonly vendor: string;
  readonly notes: string;
  readonly color: string;
  readonly dash: string;
  readonly rank: number | null;
  readonly pass: boolean;
  readonly coverage: 'full' | 'partial';
  /** "PASS", "FAIL", or "NOT RANKED: partial data". */
  readonly verdict: string;
  readonly reason: string;
  /** Where its data leave a band uncovered, in words. */
  readonly gaps: readonly string[];
  /** "catalog part VT-BPF-2450, revision B (content/parts/vt-bpf-2450/part.yaml)" or "Touchstone files". */
  readonly source: string;
  readonly portMap: string;
  /** "renormalized from 75 Ω to 50 Ω", or ''. */
  readonly renormalized: string;
  readonly units: ReadonlyArray<{
    readonly unit: string;
    readonly file: string;
    readonly sha256: string;
    readonly points: number;
    readonly range: string;
    readonly reference: string;
    readonly touchstone: string;
  }>;
}

export interface ComparisonPage {
  readonly slug: string;
  readonly url: string;
  readonly pdfUrl: string | null;
  readonly title: string;
  readonly description: string;
  readonly date: string;
  readonly classTitle: string;
  readonly reference: string;
  readonly bands: ReadonlyArray<{ readonly name: string; readonly range: string }>;
  readonly requirement: ReadonlyArray<{
    readonly label: string;
    readonly on: string;
    readonly band: string;
    readonly bandRange: string;
    readonly limit: string;
  }>;
  readonly candidates: readonly ComparisonCandidate[];
  readonly rows: ReadonlyArray<{
    readonly label: string;
    readonly on: string;
    readonly band: string;
    readonly limit: string;
    readonly cells: readonly ComparisonCell[];
  }>;
  /** Ranked candidates best first, then the unranked, each with its reason. */
  readonly ranking: ReadonlyArray<{ readonly rank: string; readonly label: string; readonly reason: string }>;
  readonly baseline: string;
  /** Per limit: each other candidate's worst minus the baseline's. */
  readonly differences: ReadonlyArray<{
    readonly label: string;
    readonly on: string;
    readonly band: string;
    readonly cells: ReadonlyArray<{ readonly label: string; readonly text: string; readonly value: number | null }>;
  }>;
  readonly plots: readonly PlotBlock[];
  readonly differencePlots: readonly PlotBlock[];
  readonly warnings: ReadonlyArray<{ readonly where: string; readonly message: string }>;
  /** The JSON of `scatterbook compare --json`, for machine readers and tests. */
  readonly comparisonJson: string;
  /** The comparison file and every candidate's files, for the manifest. */
  readonly inputs: Inputs;
}
