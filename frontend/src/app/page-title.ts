import { useEffect } from 'react';
import { useLocation, useMatches } from 'react-router-dom';

/** What a route's `handle` may carry: the page's name in the browser's tab and history. */
export interface RouteHandle {
  title?: string;
}

const PRODUCT = 'Cleancase';

export const documentTitle = (name: string | null | undefined) => (name ? `${name} · ${PRODUCT}` : PRODUCT);

/** The name of the deepest matched route that has one. */
export function routeTitle(matches: readonly ({ handle?: unknown } | { route: { handle?: unknown } })[]): string | null {
  for (let i = matches.length - 1; i >= 0; i--) {
    const m = matches[i];
    const handle = m && ('route' in m ? m.route.handle : m.handle);
    const title = (handle as RouteHandle | undefined)?.title;
    if (title) return title;
  }
  return null;
}

/** The deepest route's name, for pages that add their own subject to it (a unit's tab, a plant). */
export const useRouteTitle = () => routeTitle(useMatches());

/**
 * A page whose name depends on its data (a plant's, a unit's) sets it after rendering; the router has already set
 * the route's plain name on every navigation, so this runs again on each one.
 */
export function usePageTitle(name: string | null | undefined) {
  const { key } = useLocation();
  useEffect(() => {
    document.title = documentTitle(name);
  }, [name, key]);
}
