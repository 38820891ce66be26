// The stage view's page on paper: black on white, no buttons, no song split across two sheets. Web only.
import { useEffect } from 'react';
import { Platform } from 'react-native';

const PRINT_CSS = `
@media print {
  @page { margin: 12mm; }
  html, body, #root, #root * { background: #fff !important; color: #000 !important; }
  #stage-toolbar { display: none !important; }
  [data-testid="stage-song"] { break-inside: avoid; page-break-inside: avoid; }
}`;

/** Adds the print rules to the page while the stage view is open. */
export function usePrintStyles() {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    const style = document.createElement('style');
    style.setAttribute('data-print', 'stage');
    style.textContent = PRINT_CSS;
    document.head.appendChild(style);
    return () => style.remove();
  }, []);
}

/** Opens the browser's print dialog (the web app only). */
export const printPage = () => {
  if (Platform.OS === 'web' && typeof window !== 'undefined') window.print();
};
