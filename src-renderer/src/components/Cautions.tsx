import { CAUTIONS_ONE_LINE } from '@shared/text/cautions';

/** The cautions, always on screen: statistical precision only; defer to ethics and regulators. */
export function Cautions() {
  return (
    <p className="cautions" role="note">
      <strong>Caution.</strong> {CAUTIONS_ONE_LINE}
    </p>
  );
}
