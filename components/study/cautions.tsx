import { Notice } from '@/components/ui/notice';

/**
 * The cautions FadeLedger shows beside every study (product.md): predictions are statistics;
 * installation work is for qualified people; transmit terminals add RF exposure.
 */
export function StudyCautions({ hasUplink, largestDiameterM, totalAttenuation = false }: { hasUplink: boolean; largestDiameterM: number; totalAttenuation?: boolean }) {
  return (
    <section aria-labelledby="cautions-title" className="space-y-3">
      <h2 id="cautions-title" className="text-base font-semibold text-stone-900">
        Before you quote or install
      </h2>
      <Notice tone="info" title="Statistics, not guarantees">
        Outage minutes and availability are long-term averages from ITU-R methods (P.618, P.837, P.839, P.841{totalAttenuation ? ', with gases P.676, clouds P.840 and the ITU-R digital maps at the site' : ''}) for an average year.
        They are statistical predictions, not a guarantee for any one year: any year can be wetter or drier, and the worst month can be much worse than the
        yearly figure suggests. Local measured rain data, where you have it, beats a global model.
      </Notice>
      <Notice tone="caution" title="Work at height, grounding and wind load">
        Mounting, grounding and lightning protection follow the dish and mount manufacturer&apos;s instructions and local building and electrical codes; the
        work belongs to qualified, licensed installers.
        {largestDiameterM >= 1.2 && (
          <> A {Math.round(largestDiameterM * 100)} cm reflector catches a lot of wind: check the mount, the wall or roof it is fixed to, and the wind-load figures for the site before choosing it.</>
        )}
      </Notice>
      {hasUplink && (
        <Notice tone="caution" title="Transmitting terminal: RF exposure">
          This service transmits from the dish. Keep people out of the beam while it transmits, mark the exclusion zone, and apply the RF exposure limits of
          the local regulator.
        </Notice>
      )}
    </section>
  );
}
