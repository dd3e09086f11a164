/**
 * The one selection of the plan & profile view, shared by the map, the profile strip and the
 * table: what is selected (click or tap) and what is under the pointer (hover). A tiny external
 * store read with useSyncExternalStore, so a hover redraws only what subscribes to it.
 */
import { createContext, useContext, useSyncExternalStore } from 'react';

export type PlanItemType = 'line' | 'hole' | 'bore' | 'pit';

export interface PlanItem {
  type: PlanItemType;
  id: number;
}

export interface SelectionState {
  selected: PlanItem | null;
  hovered: PlanItem | null;
}

export interface SelectionStore {
  get(): SelectionState;
  select(item: PlanItem | null): void;
  hover(item: PlanItem | null): void;
  subscribe(listener: () => void): () => void;
}

export const sameItem = (a: PlanItem | null | undefined, b: PlanItem | null | undefined): boolean =>
  a === b || (!!a && !!b && a.type === b.type && a.id === b.id);

export function createSelectionStore(initial: SelectionState = { selected: null, hovered: null }): SelectionStore {
  let state = initial;
  const listeners = new Set<() => void>();
  const set = (next: SelectionState) => {
    if (sameItem(next.selected, state.selected) && sameItem(next.hovered, state.hovered)) return;
    state = next;
    for (const l of listeners) l();
  };
  return {
    get: () => state,
    select: (item) => set({ ...state, selected: item }),
    hover: (item) => set({ ...state, hovered: item }),
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export const SelectionContext = createContext<SelectionStore | null>(null);

export function useSelectionStore(): SelectionStore {
  const store = useContext(SelectionContext);
  if (!store) throw new Error('useSelectionStore outside SelectionContext');
  return store;
}

/** The current selection and hover. */
export function useSelection(): SelectionState {
  const store = useSelectionStore();
  return useSyncExternalStore(store.subscribe, store.get, store.get);
}
