import type { CornerFigures } from '../../../core/corner/corner';
import { cornerAnalyze, type CornerAnalysis } from '../../../core/figures/corner-analysis';
import { cornerFileParse } from '../../../core/corner/corner-file';
import type { UnitSystem } from '../../../core/units/units';
import type { HandlerInput, HandlerOutput } from '../contract';
import type { AnalyzeReport } from '../schemas';

/** A corner's headline figures as the contract reports them (the analyze report's first keys). */
export function headlineFiguresOf(f: CornerFigures) {
  return {
    wheelRate: f.wheelRate,
    rideRate: f.rideRate,
    rideFrequencyHz: f.rideFrequencyHz,
    wheelHopFrequencyHz: f.wheelHopFrequencyHz,
    dampingRatio: { ...f.dampingRatio },
    dampingClass: { ...f.dampingClass },
  };
}

/** The contract's report of an analysis: DESIGN.md's keys only, SI. */
export function analyzeReportOf(a: CornerAnalysis): AnalyzeReport {
  const f = a.figures;
  const modes: AnalyzeReport['modes'] = {};
  if (a.modes.body)
    modes.body = { frequencyHz: a.modes.body.frequencyHz, dampingRatio: a.modes.body.dampingRatio };
  if (a.modes.wheelHop) {
    modes.wheelHop = {
      frequencyHz: a.modes.wheelHop.frequencyHz,
      dampingRatio: a.modes.wheelHop.dampingRatio,
    };
  }
  if (a.modes.overdamped.length > 0) modes.overdamped = a.modes.overdamped.map((m) => ({ ...m }));
  const report: AnalyzeReport = {
    ...headlineFiguresOf(f),
    modes,
    frf: a.frf.map((r) => ({ ...r })),
    step: { overshoot: a.step.overshoot, settlingTime: a.step.settlingTime },
    warnings: a.warnings.map((w) => ({ ...w })),
  };
  if (a.randomRoad) {
    const r = a.randomRoad;
    report.randomRoad = {
      bodyAccelRms: r.bodyAccelRms,
      bodyAccelWeightedRms: r.bodyAccelWeightedRms,
      tireLoadRmsRatio: r.tireLoadRmsRatio,
      travelRms: r.travelRms,
    };
  }
  if (a.bump) {
    const m = a.bump.metrics;
    report.bump = {
      peakBodyAccel: m.peakBodyAccel,
      maxCompression: m.maxCompression,
      maxExtension: m.maxExtension,
      minTireLoad: m.minTireLoad,
      maxTireLoad: m.maxTireLoad,
      airborneTime: m.airborneTime,
      peakBodyDisplacement: m.peakBodyDisplacement,
      bumpStopContactTime: m.bumpStopContactTime,
    };
  }
  return report;
}

/** Reads a corner file's content and analyses it; the full analysis and its report. */
export function analyzeCornerFile(
  raw: unknown,
  options: { frequencies?: readonly number[]; units?: UnitSystem } = {},
): { analysis: CornerAnalysis; report: AnalyzeReport } {
  const analysis = cornerAnalyze(cornerFileParse(raw), options);
  return { analysis, report: analyzeReportOf(analysis) };
}

/** Handler `analyzeCorner`: the analysis of one corner file. */
export function analyzeCorner(input: HandlerInput<'analyzeCorner'>): HandlerOutput<'analyzeCorner'> {
  const options = input.frequencies ? { frequencies: input.frequencies } : {};
  return analyzeCornerFile(input.file, options).report;
}
