/**
 * The print page's state: which output, medium and options are picked (remembered per output),
 * the live preview of the real PDF, the print history and the organisation's sheet layouts.
 * The preview follows every change after a short pause, and a newer request cancels an older one.
 */
import { defineStore } from 'pinia';
import { computed, reactive, ref, shallowRef, watch } from 'vue';
import { mediaIdSchema, printOptionSchemas, printOutputs, type PrintOutput, type PrintWarning } from '../../shared/schemas/print.js';
import { defaultMedia } from '../../shared/schemas/print-records.js';
import { fieldErrors } from '../../shared/schemas/errors.js';
import { ApiError } from '../api/http.js';
import * as printApi from '../api/print.js';
import type { FetchedPdf, PrintRecord, PrintSelection, SheetLayoutRecord } from '../api/print.js';

export type PrintStatus = 'idle' | 'loading' | 'ready' | 'error';

/** Long enough to let a typed number settle, short enough that the preview seems to follow. */
export const PREVIEW_DELAY_MS = 400;

const emptyOptions = () => Object.fromEntries(printOutputs.map((o) => [o, {}])) as Record<PrintOutput, Record<string, string>>;

/** Field errors of a selection by the same schemas the server uses, so a bad value is shown before any request. */
export function selectionErrors(selection: PrintSelection): Record<string, string> {
  const options = Object.fromEntries(Object.entries(selection.options).filter(([, v]) => v !== ''));
  const errors: Record<string, string> = {};
  const media = mediaIdSchema.safeParse(selection.media);
  if (!media.success) errors.media = media.error.issues[0]?.message ?? 'Unknown medium';
  const parsed = printOptionSchemas[selection.output].safeParse(options);
  if (!parsed.success) Object.assign(errors, fieldErrors(parsed.error));
  return errors;
}

export const usePrintStore = defineStore('print', () => {
  const boardId = ref<number | null>(null);
  const output = ref<PrintOutput>('chart');
  const mediaByOutput = reactive<Record<PrintOutput, string>>({ ...defaultMedia });
  const optionsByOutput = reactive(emptyOptions());

  const selection = computed<PrintSelection>(() => ({
    output: output.value,
    media: mediaByOutput[output.value],
    options: { ...optionsByOutput[output.value] },
  }));
  const errors = computed(() => selectionErrors(selection.value));

  const previewStatus = ref<PrintStatus>('idle');
  const previewUrl = ref<string | null>(null);
  const previewError = ref<string | null>(null);
  const previewFields = ref<Record<string, string>>({});
  const warnings = shallowRef<PrintWarning[]>([]);
  const pageCount = ref(0);
  /** The selection the PDF on show was made for, so a PDF is never offered for other settings. */
  const previewedFor = ref<string | null>(null);

  const history = shallowRef<PrintRecord[]>([]);
  const historyStatus = ref<PrintStatus>('idle');
  const layouts = shallowRef<SheetLayoutRecord[]>([]);

  let timer: ReturnType<typeof setTimeout> | null = null;
  let inFlight: AbortController | null = null;
  /** Bumped by each preview, so a late answer for an older choice is dropped. */
  let generation = 0;

  function setPreviewUrl(url: string | null) {
    if (previewUrl.value) URL.revokeObjectURL(previewUrl.value);
    previewUrl.value = url;
  }

  /** Never leaves a PDF of other settings on show, nor its warnings, beside an error. */
  function showNoPreview(message: string | null, fields: Record<string, string>): void {
    setPreviewUrl(null);
    previewedFor.value = null;
    warnings.value = [];
    pageCount.value = 0;
    previewError.value = message;
    previewFields.value = fields;
    previewStatus.value = 'error';
  }

  /** Fetches the PDF for what is picked now; an older request still running is cancelled. */
  async function refreshPreview(): Promise<void> {
    if (boardId.value === null) return;
    if (Object.keys(errors.value).length) {
      // The marked field says what is wrong; an answer still coming is for other settings.
      inFlight?.abort();
      generation++;
      showNoPreview(null, {});
      return;
    }
    inFlight?.abort();
    const controller = new AbortController();
    inFlight = controller;
    const mine = ++generation;
    previewStatus.value = 'loading';
    const asked = selection.value;
    try {
      const pdf = await printApi.fetchPdf(boardId.value, asked, { signal: controller.signal });
      if (controller.signal.aborted) return;
      setPreviewUrl(URL.createObjectURL(pdf.blob));
      previewedFor.value = JSON.stringify(asked);
      warnings.value = pdf.warnings;
      pageCount.value = pdf.pageCount;
      if (pdf.warnings.at(-1)?.code === 'more-warnings') void loadAllWarnings(mine);
      previewError.value = null;
      previewFields.value = {};
      previewStatus.value = 'ready';
    } catch (err) {
      if (controller.signal.aborted) return;
      showNoPreview(err instanceof Error ? err.message : String(err), err instanceof ApiError ? err.fields : {});
    } finally {
      if (inFlight === controller) inFlight = null;
    }
  }

  /** The header carries the first warnings only; the companion call lists them all. */
  async function loadAllWarnings(mine: number): Promise<void> {
    if (boardId.value === null) return;
    const all = await printApi.checkPrint(boardId.value, selection.value).catch(() => null);
    if (all && mine === generation) warnings.value = all.warnings;
  }

  function schedulePreview() {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void refreshPreview();
    }, PREVIEW_DELAY_MS);
  }

  watch(selection, schedulePreview, { deep: true });

  async function loadHistory(): Promise<void> {
    if (boardId.value === null) return;
    historyStatus.value = 'loading';
    try {
      history.value = (await printApi.listPrints(boardId.value)).items;
      historyStatus.value = 'ready';
    } catch {
      historyStatus.value = 'error';
    }
  }

  async function loadLayouts(): Promise<void> {
    layouts.value = (await printApi.listSheetLayouts().catch(() => ({ items: [] }))).items;
  }

  /** Starts the page for a board: history, layouts and a first preview at once. */
  /**
   * Opens a board's print page; a link may name the output and its options (the survey links to
   * `?output=changeover` and `?output=flags&at=junction-boxes`). Unknown names are ignored.
   */
  function open(id: number, preset: { output?: unknown; options?: Record<string, string> } = {}): void {
    close();
    boardId.value = id;
    if (typeof preset.output === 'string' && (printOutputs as readonly string[]).includes(preset.output)) {
      const chosen = preset.output as PrintOutput;
      output.value = chosen;
      const known = Object.keys(printOptionSchemas[chosen].shape);
      for (const [k, v] of Object.entries(preset.options ?? {})) if (known.includes(k)) optionsByOutput[chosen][k] = v;
    }
    void loadHistory();
    void loadLayouts();
    void refreshPreview();
  }

  function close(): void {
    generation++;
    if (timer) clearTimeout(timer);
    timer = null;
    inFlight?.abort();
    inFlight = null;
    setPreviewUrl(null);
    previewedFor.value = null;
    boardId.value = null;
    previewStatus.value = 'idle';
    warnings.value = [];
    history.value = [];
  }

  /** The PDF for a download or the print dialog: recorded in the history, which is then reloaded. */
  async function fetchForPrinting(): Promise<FetchedPdf> {
    if (boardId.value === null) throw new Error('No board is open');
    const pdf = await printApi.fetchPdf(boardId.value, selection.value, { record: true });
    void loadHistory();
    return pdf;
  }

  async function fetchPack(): Promise<{ blob: Blob; fileName: string }> {
    if (boardId.value === null) throw new Error('No board is open');
    const pack = await printApi.fetchPack(boardId.value);
    void loadHistory();
    return pack;
  }

  /**
   * Download, print and pack are offered only while the settings picked make a PDF: none while
   * the browser's own check fails, while the last preview was refused, and until the preview of
   * what is picked now has come (the PDF printed is then the one seen).
   */
  const printable = computed(
    () => Object.keys(errors.value).length === 0 && previewStatus.value === 'ready' && previewedFor.value === JSON.stringify(selection.value),
  );

  /**
   * True when every field the server named in its refusal is a control on the page (the medium
   * or one of this output's options), so the message is shown there and not again over the preview.
   */
  const previewErrorBesideFields = computed(() => {
    const keys = Object.keys(previewFields.value);
    const shape = printOptionSchemas[output.value].shape;
    return keys.length > 0 && keys.every((k) => k === 'media' || k in shape);
  });

  /** The latest revision this output was printed at, for "changed since last print". */
  const lastPrintedRevision = computed(() => history.value.find((p) => p.output === output.value)?.revision ?? null);

  return {
    boardId,
    output,
    mediaByOutput,
    optionsByOutput,
    selection,
    errors,
    previewStatus,
    previewUrl,
    previewError,
    previewFields,
    warnings,
    pageCount,
    history,
    historyStatus,
    layouts,
    lastPrintedRevision,
    printable,
    previewErrorBesideFields,
    open,
    close,
    refreshPreview,
    loadHistory,
    loadLayouts,
    fetchForPrinting,
    fetchPack,
  };
});
