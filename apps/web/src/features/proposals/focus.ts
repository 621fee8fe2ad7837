import type { CheckItem } from './api';
import { proposalHref } from '@/lib/paths';

/**
 * A request, carried in the address, to show one field: the Checks list links to
 * `/proposals/SP27-0014/observations?field=bandwidthMHz&observation=…`. `key` is the navigation's
 * own key, so following the same link twice focuses the field twice.
 */
export interface FocusRequest {
  key: string;
  field?: string;
  observationId?: string;
  targetId?: string;
}

export function focusRequestOf(search: URLSearchParams, key: string): FocusRequest | undefined {
  const field = search.get('field') ?? undefined;
  const observationId = search.get('observation') ?? undefined;
  const targetId = search.get('target') ?? undefined;
  if (!field && !observationId && !targetId) return undefined;
  return { key, field, observationId, targetId };
}

/** The address of the field a finding is about. */
export function checkHref(reference: string, item: CheckItem): string {
  const params = new URLSearchParams();
  if (item.field) params.set('field', item.field);
  if (item.observationId) params.set('observation', item.observationId);
  if (item.targetId) params.set('target', item.targetId);
  const search = params.toString();
  return `${proposalHref(reference, item.section)}${search ? `?${search}` : ''}`;
}

/**
 * Runs a focus move after the app frame's own: on every navigation the frame focuses the new
 * screen's main element, in an effect that runs after the screen's effects. Returns the cleanup.
 */
export function focusAfterNavigation(move: () => void): () => void {
  const timer = window.setTimeout(move, 0);
  return () => window.clearTimeout(timer);
}
