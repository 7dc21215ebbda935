import { useCallback, useEffect, useRef, useState } from 'react';
import type { OwnerBusiness } from '../api/businessApi';
import { draftOf, isChanged, type BusinessDraft } from '../model/businessForm';

const keyOf = (businessId: string) => `panelpass-settings-draft-${businessId}`;

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

function readKept(businessId: string): Partial<BusinessDraft> | null {
  try {
    const text = storage()?.getItem(keyOf(businessId));
    const kept = text ? (JSON.parse(text) as Partial<BusinessDraft> | null) : null;
    // A copy from an older form, or damaged: not worth restoring.
    const lists = ['services', 'sizeClasses', 'conditions', 'addOns', 'bands'] as const;
    if (!kept || !lists.every((l) => Array.isArray(kept[l])) || typeof kept.name !== 'string') {
      return null;
    }
    return kept;
  } catch {
    return null;
  }
}

/**
 * The Settings form's draft. Changes not yet saved are kept on the phone as they are typed,
 * so a failed save, no signal or a closed app loses nothing; they come back on opening
 * Settings again (`restored`) until saved or discarded.
 */
export function useSettingsDraft(business: OwnerBusiness | null) {
  const [draft, setDraft] = useState<BusinessDraft | null>(null);
  const [restored, setRestored] = useState(false);
  const started = useRef<string | null>(null);
  const businessId = business?.id ?? '';

  // The first answer fills the form (or the kept changes do).
  useEffect(() => {
    if (!business || started.current === business.id) return;
    started.current = business.id;
    const saved = draftOf(business);
    const keptPart = readKept(business.id);
    // Fields the kept copy lacks (a newer form) are filled from the server's.
    const kept = keptPart ? { ...saved, ...keptPart } : null;
    if (kept && isChanged(kept, business)) {
      setDraft(kept);
      setRestored(true);
    } else {
      setDraft(saved);
    }
  }, [business]);

  // Keep what differs from the server; forget it once it is the same.
  useEffect(() => {
    if (!draft || !business) return;
    try {
      if (isChanged(draft, business)) storage()?.setItem(keyOf(business.id), JSON.stringify(draft));
      else storage()?.removeItem(keyOf(business.id));
    } catch {
      // A full or blocked storage: the changes still hold while the screen is open.
    }
  }, [draft, business]);

  /** After a save: the form shows what the server now holds. */
  const resetTo = useCallback((saved: OwnerBusiness) => {
    setDraft(draftOf(saved));
    setRestored(false);
    try {
      storage()?.removeItem(keyOf(saved.id));
    } catch {
      // Nothing kept to forget.
    }
  }, []);

  const discard = useCallback(() => {
    if (business) resetTo(business);
  }, [business, resetTo]);

  return {
    businessId,
    draft,
    setDraft,
    restored,
    changed: draft !== null && business !== null && isChanged(draft, business),
    resetTo,
    discard,
  };
}
