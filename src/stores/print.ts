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

  /** Fetches the PDF for what is picked now; an older request still running is cancelled. */
  async function refreshPreview(): Promise<void> {
    if (boardId.value === null || Object.keys(errors.value).length) return;
    inFlight?.abort();
    const controller = new AbortController();
    inFlight = controller;
    const mine = ++generation;
    previewStatus.value = 'loading';
    try {
      const pdf = await printApi.fetchPdf(boardId.value, selection.value, { signal: controller.signal });
      if (controller.signal.aborted) return;
      setPreviewUrl(URL.createObjectURL(pdf.blob));
      warnings.value = pdf.warnings;
      pageCount.value = pdf.pageCount;
      if (pdf.warnings.at(-1)?.code === 'more-warnings') void loadAllWarnings(mine);
      previewError.value = null;
      previewFields.value = {};
      previewStatus.value = 'ready';
    } catch (err) {
      if (controller.signal.aborted) return;
      previewError.value = err instanceof Error ? err.message : String(err);
      previewFields.value = err instanceof ApiError ? err.fields : {};
      previewStatus.value = 'error';
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
    timer = setTimeout(() => { timer = null; void refreshPreview(); }, PREVIEW_DELAY_MS);
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
  function open(id: number): void {
    close();
    boardId.value = id;
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

  /** The latest revision this output was printed at, for "changed since last print". */
  const lastPrintedRevision = computed(() => history.value.find((p) => p.output === output.value)?.revision ?? null);

  return {
    boardId, output, mediaByOutput, optionsByOutput, selection, errors,
    previewStatus, previewUrl, previewError, previewFields, warnings, pageCount,
    history, historyStatus, layouts, lastPrintedRevision,
    open, close, refreshPreview, loadHistory, loadLayouts, fetchForPrinting, fetchPack,
  };
});
