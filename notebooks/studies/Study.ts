// A study: prose, controls and named values. Every named value is a node of the reactive
// graph; figures are named values too, so a control change redraws only the figures that
// (transitively) depend on it. The same definition runs in the page and in `alight report`.
import type { StudyId } from '../analysis/Analysis.js';
import type { Definition } from '../runtime/ReactiveGraph.js';
import type { Parameter } from './Parameter.js';

/** A number shown on the page and in the report; `value` carries full precision for checks. */
export interface KeyNumber {
  key: string;
  label: string;
  value: number | null;
  text: string;
}

/** What a figure value holds: its markup (SVG or an HTML table), export data, and whether it is complete. */
export interface FigureOutput {
  kind: 'svg' | 'table';
  markup: string;
  /** The figure's data as CSV (exported by the CSV button); null when it has none. */
  csv: string | null;
  numbers: readonly KeyNumber[];
  /** False while trials are still arriving (partial results). */
  final: boolean;
  /** A line shown under the figure (e.g. "12 of 40 trials"). */
  status: string;
  /** Set when the computation behind the figure failed (the report refuses to print it). */
  failure?: string;
  /** A file offered for download beside the figure (e.g. the sweep's JSON Lines results). */
  attachment?: { label: string; fileName: string; text: string };
}

export interface StudyCell {
  name: string;
  /** Names of parameters, cells, or the inputs every study has: scenario, seed, jobs (and logFiles for replay). */
  inputs: readonly string[];
  compute: Definition;
}

export interface StudyFigure extends StudyCell {
  title: string;
  caption: string;
  /** Wide figures span both columns of the page. */
  wide?: boolean;
}

/**
 * Reading order: prose, figures by name, and (replay) the log-folder drop target with its text.
 * Prose about working the page (controls, workers, dropping files) is `pageOnly`: the headless
 * report leaves it out, since its reader has no controls.
 */
export type StudyBlock = { prose: string; pageOnly?: boolean } | { figure: string } | { dropzone: string };

export interface Study {
  id: StudyId;
  title: string;
  /** One paragraph under the title: the question the study answers. */
  lede: string;
  parameters: readonly Parameter[];
  cells: readonly StudyCell[];
  figures: readonly StudyFigure[];
  /** Reading order: prose paragraphs and figures by name. */
  blocks: readonly StudyBlock[];
}

/** Inputs every study's graph has besides its parameters. */
export const STUDY_INPUTS = ['scenario', 'seed', 'jobs', 'logFiles'] as const;
