// The cautions shown with every result: in the app, the About box, reports and the command line.
export const CAUTIONS: readonly string[] = [
  'These numbers concern statistical precision only: they say nothing about clinical utility or patient safety.',
  'They rest on anticipated values that may be wrong; check them against the range of plausible assumptions.',
  'Defer to your ethics committee, regulators and local practice, which may require larger or different samples.',
];

export const CAUTIONS_ONE_LINE =
  'Statistical precision only — not clinical utility or safety. Defer to your ethics committee, regulators and local practice.';
