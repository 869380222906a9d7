// Builds a study's reactive graph from an analysis: inputs (scenario, seed, jobs, logFiles and
// every parameter), the study's cells, and its figures (observed). Shared by page and report.
import type { Analysis } from '../analysis/Analysis.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { FigureOutput, Study } from '../studies/Study.js';
import { ReactiveGraph } from './ReactiveGraph.js';

export interface FigureObserver {
  /** A new value of a figure (partial or final). */
  figure(name: string, output: FigureOutput): void;
  /** A figure (or something it needs) failed. */
  failed(name: string, message: string): void;
  pending?(name: string): void;
}

export interface MountedStudy {
  graph: ReactiveGraph;
  /** Change one parameter (or seed/scenario/logFiles): only its dependants recompute. */
  set(name: string, value: unknown): void;
  dispose(): void;
}

export function mountStudy(study: Study, analysis: Analysis, jobs: JobRunner, observer: FigureObserver, logFiles: unknown = null): MountedStudy {
  const graph = new ReactiveGraph({ jobs });
  graph.input('scenario', analysis.scenario);
  graph.input('seed', analysis.seed);
  graph.input('logFiles', logFiles);
  for (const p of study.parameters) graph.input(p.name, analysis.parameters[p.name] ?? p.default);
  for (const cell of study.cells) graph.define(cell.name, cell.inputs, cell.compute);
  for (const figure of study.figures) {
    graph.define(figure.name, figure.inputs, figure.compute, {
      pending: () => observer.pending?.(figure.name),
      fulfilled: (value) => observer.figure(figure.name, value as FigureOutput),
      rejected: (error) => observer.failed(figure.name, (error as Error)?.message ?? String(error)),
    });
  }
  return {
    graph,
    set: (name, value) => graph.set(name, value),
    dispose: () => graph.dispose(),
  };
}

/** Resolves with every figure's final output (or rejects with the first failure): for headless use. */
export function settleFigures(study: Study, analysis: Analysis, jobs: JobRunner, logFiles: unknown = null): Promise<Map<string, FigureOutput>> {
  return new Promise((resolve, reject) => {
    const outputs = new Map<string, FigureOutput>();
    let mounted: MountedStudy | null = null;
    const check = (): void => {
      if (study.figures.every((f) => outputs.get(f.name)?.final)) {
        mounted?.dispose();
        resolve(outputs);
      }
    };
    mounted = mountStudy(study, analysis, jobs, {
      figure: (name, output) => {
        outputs.set(name, output);
        check();
      },
      failed: (name, message) => {
        mounted?.dispose();
        reject(new Error(`figure "${name}": ${message}`));
      },
    }, logFiles);
  });
}
