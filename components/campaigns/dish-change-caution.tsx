import { Notice } from '@/components/ui/notice';

/**
 * The installation caution beside a campaign (product.md "Cautions the product shows"): an upgrade
 * campaign is a list of roofs to climb and larger reflectors to hang, so work at height and wind load
 * are named, not only the mount.
 */
export function DishChangeCaution() {
  return (
    <Notice tone="caution" title="Before you change a dish: work at height, grounding and wind load">
      A larger reflector is not a like-for-like swap: it catches more wind, so the mount and the wall or roof it is fixed to must be rated for it; check the
      wind-load figures for the site. Work at height, grounding and lightning protection follow the manufacturer&apos;s instructions and local building and
      electrical codes; the work belongs to qualified, licensed installers.
    </Notice>
  );
}
