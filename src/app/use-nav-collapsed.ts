// Whether the navigation is folded away. The choice is remembered in this browser for screens from
// 768 px; a phone-sized window always starts folded (the open navigation lies over the page there)
// and folds again after each move to another page.
import { useCallback, useEffect, useState } from 'react';
import { useLocation } from 'react-router';

const STORAGE_KEY = 'meltwire.nav-collapsed';
const NARROW = '(max-width: 767px)';

function isNarrow(): boolean {
  return window.matchMedia(NARROW).matches;
}

function rememberedChoice(): boolean {
  try {
    return window.localStorage.getItem(STORAGE_KEY) === 'true';
  } catch {
    return false; // storage refused (private mode): start open
  }
}

function remember(collapsed: boolean): void {
  try {
    window.localStorage.setItem(STORAGE_KEY, String(collapsed));
  } catch {
    // storage refused: the choice lasts until the page is reloaded
  }
}

export function useNavCollapsed(): { collapsed: boolean; toggle: () => void; collapse: () => void } {
  const [collapsed, setCollapsed] = useState(() => isNarrow() || rememberedChoice());
  const { pathname } = useLocation();

  useEffect(() => {
    if (isNarrow()) setCollapsed(true);
  }, [pathname]);

  const toggle = useCallback(() => {
    setCollapsed((was) => {
      if (!isNarrow()) remember(!was);
      return !was;
    });
  }, []);
  const collapse = useCallback(() => setCollapsed(true), []);
  return { collapsed, toggle, collapse };
}
