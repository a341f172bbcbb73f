import { EmptyState } from './empty-state';

/** Shown instead of a page the active role may not open, with the reason. */
export function NotPermitted({ what, reason }: { what: string; reason: string }) {
  return <EmptyState title={`${what} is not available to you`} next={`${reason}. Ask an administrator of this organisation if you need it.`} />;
}

/** Shown on organisation pages when the person belongs to no organisation (or none is active). */
export function NoOrganisation() {
  return <EmptyState title="No organisation is active" next="Pick one from the organisation menu in the header, or start a new one there." />;
}
