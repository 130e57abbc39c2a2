/** Opening the browser's print dialog on a fetched PDF (saving one is `saveBlob` in useFileTransfer). */

/**
 * Opens the print dialog on a PDF through a hidden frame; where the browser will not print a
 * framed PDF, the PDF opens in a new tab to print from there.
 */
export function printBlob(blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const frame = document.createElement('iframe');
  frame.style.cssText = 'position:fixed;right:0;bottom:0;width:1px;height:1px;border:0;opacity:0';
  frame.title = 'PDF to print';
  frame.src = url;
  frame.addEventListener('load', () => {
    try {
      frame.contentWindow?.focus();
      frame.contentWindow?.print();
    } catch {
      window.open(url, '_blank', 'noopener');
    }
  });
  document.body.append(frame);
  setTimeout(() => {
    frame.remove();
    URL.revokeObjectURL(url);
  }, 10 * 60_000);
}
