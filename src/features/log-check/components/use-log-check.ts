import { useCallback, useMemo, useReducer, useRef } from 'react';
import { isApiError } from '../../../lib/api-client';
import { isUploadCancelled, type UploadProgress } from '../../../lib/upload';
import { fileTooLargeMessage, hasAcceptedExtension } from '../../../lib/upload-size';
import { logFileUploadLimit } from '../../../../shared/upload-limits';
import type { AnalysisRequestInput, LogPreview, ParseError } from '../../../../shared/schemas/analysis';
import { useAnalyseLog, type AnalyseLogOutcome } from '../api/analyse-log';
import { draftFromPreview, requestFromDraft, type MappingDraft } from './mapping-draft';
import { readChartSeries, type ChartSeries } from './read-chart-series';

/** 'reading': the first look at a file, with the server's guessed mapping; 'analysing': with the tester's mapping. */
export type LogCheckStage = 'reading' | 'analysing';

interface Sending {
  stage: LogCheckStage;
  file: File;
  request: AnalysisRequestInput | null;
}

/** How the server read a file; kept after another file is chosen so a file with the same header keeps the mapping. */
export interface LogReading {
  file: File;
  preview: LogPreview;
  /** The server's guess as a draft, to mark the fields nobody has checked yet; null when it could not guess. */
  guess: MappingDraft | null;
}

export interface LogFailure {
  file: File;
  stage: LogCheckStage;
  errors: ParseError[];
  message: string;
  hasPreview: boolean;
}

export interface LogResult {
  file: File;
  outcome: Extract<AnalyseLogOutcome, { kind: 'analysed' }>;
  /** The request as sent, to tell when the form no longer matches the figures. */
  requestJson: string;
}

interface LogChart {
  file: File;
  requestJson: string;
  series: ChartSeries | null;
}

export interface LogCheckState {
  file: File | null;
  /** Why the chosen file was refused (name, size, empty) or what the server said about it. */
  fileError: string | null;
  reading: LogReading | null;
  draft: MappingDraft | null;
  failure: LogFailure | null;
  requestError: { message: string; signedOut: boolean } | null;
  sending: { stage: LogCheckStage; progress: UploadProgress } | null;
  cancelled: boolean;
  result: LogResult | null;
  chart: LogChart | null;
}

type Action =
  | { type: 'refused'; message: string }
  | { type: 'sent'; sending: Sending }
  | { type: 'progressed'; stage: LogCheckStage; progress: UploadProgress }
  | { type: 'answered'; sending: Sending; outcome: AnalyseLogOutcome }
  | { type: 'failed'; error: unknown }
  | { type: 'settled' }
  | { type: 'cancelled' }
  | { type: 'draft-changed'; draft: MappingDraft }
  | { type: 'chart-read'; chart: LogChart };

export const initialLogCheckState: LogCheckState = {
  file: null,
  fileError: null,
  reading: null,
  draft: null,
  failure: null,
  requestError: null,
  sending: null,
  cancelled: false,
  result: null,
  chart: null,
};

function describeFailure(error: unknown): Pick<LogCheckState, 'fileError' | 'requestError'> | null {
  if (isUploadCancelled(error)) return null;
  if (!isApiError(error))
    return { fileError: null, requestError: { message: 'Something went wrong. Try again.', signedOut: false } };
  if (error.status === 401) {
    return {
      fileError: null,
      requestError: { message: 'Your session ended, so the file was not read.', signedOut: true },
    };
  }
  // Problems with the file itself (missing, too large, not a text file) belong beside the file input; the server's
  // message says what to change, its field note only repeats it in short.
  if (error.fields.file || error.status === 413 || error.status === 415) {
    return { fileError: error.message, requestError: null };
  }
  return { fileError: null, requestError: { message: error.message, signedOut: false } };
}

/** The log check as a state machine: file chosen → read (preview + guess) → mapping confirmed → analysing → result. */
export function logCheckReducer(state: LogCheckState, action: Action): LogCheckState {
  switch (action.type) {
    case 'refused':
      return { ...state, fileError: action.message };
    case 'sent':
      return {
        ...state,
        file: action.sending.file,
        fileError: action.sending.stage === 'reading' ? null : state.fileError,
        cancelled: false,
        requestError: null,
        failure: null,
        sending: {
          stage: action.sending.stage,
          progress: { phase: 'uploading', loadedBytes: 0, totalBytes: action.sending.file.size },
        },
      };
    case 'progressed':
      return state.sending ? { ...state, sending: { stage: action.stage, progress: action.progress } } : state;
    case 'answered': {
      const { sending, outcome } = action;
      const next: LogCheckState = { ...state, fileError: null };
      if (sending.stage === 'reading' && outcome.preview) {
        const previous = state.reading && state.draft ? { draft: state.draft, preview: state.reading.preview } : null;
        const guess = outcome.preview.guessedMapping ? draftFromPreview(outcome.preview, null) : null;
        next.reading = { file: sending.file, preview: outcome.preview, guess };
        next.draft = draftFromPreview(outcome.preview, previous);
      }
      if (outcome.kind === 'unreadable') {
        next.failure = {
          file: sending.file,
          stage: sending.stage,
          errors: outcome.errors,
          message: outcome.message,
          hasPreview: outcome.preview !== null,
        };
      } else if (sending.stage === 'analysing' && sending.request) {
        // The first answer analyses with the guessed mapping; it is never shown as a result.
        next.result = { file: sending.file, outcome, requestJson: JSON.stringify(sending.request) };
      }
      return next;
    }
    case 'failed': {
      const described = describeFailure(action.error);
      return described ? { ...state, ...described } : state;
    }
    case 'settled':
      return { ...state, sending: null };
    case 'cancelled':
      return { ...state, sending: null, cancelled: true };
    case 'draft-changed':
      return { ...state, draft: action.draft };
    case 'chart-read':
      return { ...state, chart: action.chart };
  }
}

/** Why a chosen file is refused before anything is sent, or null when it may go. */
export function refuseLogFile(file: File): string | null {
  if (!hasAcceptedExtension(file.name, logFileUploadLimit)) {
    return `“${file.name}” is not a logger export: choose a ${logFileUploadLimit.acceptedExtensions.join(', ')} file.`;
  }
  if (file.size === 0) return `“${file.name}” is empty.`;
  if (file.size > logFileUploadLimit.maxFileBytes) return fileTooLargeMessage(file.name, file.size, logFileUploadLimit);
  return null;
}

/**
 * The log check's state and its moves. Everything shown belongs to the chosen file: a reading, failure, result or chart
 * of an earlier file stays in memory (to keep the mapping) but is not shown.
 */
export function useLogCheck() {
  const { mutateAsync } = useAnalyseLog();
  const [state, dispatch] = useReducer(logCheckReducer, initialLogCheckState);
  const inFlight = useRef<AbortController | null>(null);
  const lastSent = useRef<Sending | null>(null);

  const send = useCallback(
    (sending: Sending) => {
      inFlight.current?.abort();
      const controller = new AbortController();
      inFlight.current = controller;
      lastSent.current = sending;
      const current = () => inFlight.current === controller;
      dispatch({ type: 'sent', sending });
      mutateAsync({
        file: sending.file,
        request: sending.request,
        signal: controller.signal,
        onProgress: (progress) => {
          if (current()) dispatch({ type: 'progressed', stage: sending.stage, progress });
        },
      })
        .then((outcome) => {
          if (!current()) return;
          dispatch({ type: 'answered', sending, outcome });
          if (outcome.kind === 'analysed' && sending.stage === 'analysing' && sending.request) {
            const requestJson = JSON.stringify(sending.request);
            void readChartSeries(sending.file, sending.request).then((series) =>
              dispatch({ type: 'chart-read', chart: { file: sending.file, requestJson, series } }),
            );
          }
        })
        .catch((error: unknown) => {
          if (current()) dispatch({ type: 'failed', error });
        })
        .finally(() => {
          if (current()) {
            inFlight.current = null;
            dispatch({ type: 'settled' });
          }
        });
    },
    [mutateAsync],
  );

  const choose = useCallback(
    (file: File) => {
      const refusal = refuseLogFile(file);
      if (refusal) dispatch({ type: 'refused', message: refusal });
      else send({ stage: 'reading', file, request: null });
    },
    [send],
  );

  const analyse = useCallback(
    (request: AnalysisRequestInput) => {
      if (state.file) send({ stage: 'analysing', file: state.file, request });
    },
    [send, state.file],
  );

  const cancel = useCallback(() => {
    inFlight.current?.abort();
    inFlight.current = null;
    dispatch({ type: 'cancelled' });
  }, []);

  /** Sends the last request again: after a cancel, a lost connection or a server error. */
  const retry = useCallback(() => {
    if (lastSent.current) send(lastSent.current);
  }, [send]);

  const setDraft = useCallback((draft: MappingDraft) => dispatch({ type: 'draft-changed', draft }), []);

  const { file } = state;
  const ofFile = <T extends { file: File }>(value: T | null): T | null => (value && value.file === file ? value : null);
  const reading = ofFile(state.reading);
  const failure = ofFile(state.failure);
  const result = ofFile(state.result);
  const chart = ofFile(state.chart);

  const currentRequestJson = useMemo(() => {
    if (!reading || !state.draft) return null;
    const built = requestFromDraft(state.draft, reading.preview);
    return built.request ? JSON.stringify(built.request) : null;
  }, [state.draft, reading]);

  return {
    file,
    fileError: state.fileError,
    reading,
    draft: state.draft,
    failure,
    result,
    /** The chart of the shown result, once the file has been drawn (null series: it could not be). */
    chartSeries: result && chart?.requestJson === result.requestJson ? chart.series : null,
    /** True when the form no longer matches the figures of the shown result. */
    resultOutdated: result !== null && currentRequestJson !== result.requestJson,
    requestError: state.requestError,
    sending: state.sending,
    cancelled: state.cancelled && state.sending === null,
    choose,
    analyse,
    cancel,
    retry,
    setDraft,
  };
}

export type LogCheck = ReturnType<typeof useLogCheck>;
