// Runs before the first paint: applies the theme saved by renderer/theme/themeState.svelte.ts
// (same storage key and values). Kept tiny and dependency-free; the app takes over once loaded.
(function () {
  try {
    var saved = window.localStorage.getItem('meridian-ledger.theme');
    if (saved === 'day' || saved === 'dark' || saved === 'night') {
      document.documentElement.setAttribute('data-theme', saved);
    }
  } catch {
    // Storage may be blocked (privacy settings); the day theme stays until the app reports it.
  }
})();
