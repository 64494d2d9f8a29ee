/**
 * The Layout screen's island: a live drawing (kept in view) with a side panel of tabs beside it:
 * the parameter form, the fret table and the exports. In 'view' mode (e.g. a client's Proof) the
 * form is left out: the drawing, navigation, readouts and fret table stay, and nothing is kept or
 * sent; `embedded` (a client's page) also leaves out the builder's tools.
 *
 * A scratch design is kept in this browser; a signed-in builder or owner can save it to Boards.
 * Both autosave through useAutosave; a board (opened from Boards, or just saved) also gets the
 * History (compare, restore) and Proofs tabs.
 *
 * The layout is computed here with the shared geometry module (src/lib/geometry) at every change:
 * the same code the server runs for every export, so there is nothing to cross-check.
 */
import { Suspense, lazy, useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { STATUS_LABELS } from '~/components/boards/board-labels.ts';
import { ApprovalNotice } from '~/components/boards/ApprovalNotice.tsx';
import { BoardDetailsForm } from '~/components/boards/BoardDetailsForm.tsx';
import { fetchBoard } from '~/components/boards/board-requests.ts';
import { ConflictNotice } from '~/components/boards/ConflictNotice.tsx';
import { RevisionHistory } from '~/components/boards/RevisionHistory.tsx';
import { SaveStatusBadge } from '~/components/boards/SaveStatusBadge.tsx';
import { SaveToBoardsButton } from '~/components/boards/SaveToBoardsButton.tsx';
import { TabList, tabPanelProps, type TabItem } from '~/components/ui/TabList.tsx';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { blankDesign } from '~/lib/presets/blank-design.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail, BoardSummary } from '~/lib/schemas/board.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { BoardDrawing } from './BoardDrawing.tsx';
import { openBoard, type OpenBoard } from './open-board.ts';
import { describeBoard } from './board-summary.ts';
import { CalibrationPanel } from './CalibrationPanel.tsx';
import { BUTTON } from './control-styles.ts';
import { createDesignStore } from './design-store.ts';
import { draftFromDesign, validateDraft, type DesignDraft } from './design-draft.ts';
import { DesignForm, type PresetChoice } from './DesignForm.tsx';
import { FretReadout } from './FretReadout.tsx';
import { FretTablePanel } from './FretTablePanel.tsx';
import { redrawStarted } from './redraw-timing.ts';
import { loadScreenPxPerMm, saveScreenPxPerMm } from './screen-calibration.ts';
import { useAutosave } from './use-autosave.ts';

export interface LayoutEditorProps {
  /** 'edit' (default) shows the form; 'view' is read-only: drawing, readouts and fret table. */
  mode?: 'edit' | 'view';
  /** The design to open; without it the editor opens the kept design, or the blank preset. */
  initialDesign?: Design | undefined;
  /**
   * The saved board `initialDesign` is the current revision of (edit mode): the design is kept in
   * Boards and autosaved. Without it the design is a scratch copy in this browser.
   */
  board?: OpenBoard | undefined;
  /** A signed-in builder or owner: a scratch design can be saved to Boards. */
  canSaveToBoards?: boolean;
  /** Inside a page with its own title (e.g. a Proof): the toolbar leaves the design name out. */
  embedded?: boolean;
}

// Loaded when their tab first opens, so the drawing's own script stays small.
const ExportPanel = lazy(() => import('~/components/export/ExportPanel.tsx'));
const ProofPanel = lazy(() => import('~/components/proof/ProofPanel.tsx'));

type Tab = 'design' | 'table' | 'exports' | 'history' | 'proofs';
const TABS_ID = 'layout';

const BLANK_PRESET_ID = 'blank';
const PRESETS: readonly PresetChoice[] = [
  { id: BLANK_PRESET_ID, label: 'Blank design' },
  ...DEMO_DESIGNS.map((demo) => ({ id: demo.id, label: demo.design.name })),
];
const SUMMARY_ID = 'board-summary';

function presetDesign(id: string): Design {
  return DEMO_DESIGNS.find((demo) => demo.id === id)?.design ?? blankDesign();
}

/** A saved design as the form will show it, or null when it no longer validates. */
function showSaved(data: unknown): { draft: DesignDraft; design: Design } | null {
  const saved = validateDesign(data);
  if (!saved.ok) return null;
  const draft = draftFromDesign(saved.design);
  const shown = validateDraft(draft);
  return shown.ok ? { draft, design: shown.design } : null;
}

export default function LayoutEditor({ mode = 'edit', initialDesign, board: initialBoard, canSaveToBoards = false, embedded = false }: LayoutEditorProps) {
  const editing = mode === 'edit';
  const [board, setBoard] = useState<OpenBoard | null>(editing ? initialBoard ?? null : null);
  // The board the autosave started from; changes only when another board is opened (saved, copied).
  const [opened, setOpened] = useState(() => (board ? { id: board.id, version: board.version } : null));
  const store = useMemo(() => createDesignStore(opened ? { kind: 'board', boardId: opened.id } : { kind: 'scratch' }), [opened]);
  const [draft, setDraft] = useState<DesignDraft>(() => draftFromDesign(initialDesign ?? blankDesign()));
  const [loaded, setLoaded] = useState(initialDesign !== undefined || !editing);
  const [fitRequest, setFitRequest] = useState(0);
  const [hoveredFret, setHoveredFret] = useState<number | null>(null);
  const [pickedFret, setPickedFret] = useState<number | null>(null);
  const [screen, setScreen] = useState(() => loadScreenPxPerMm(globalThis.localStorage));
  const [calibrating, setCalibrating] = useState(false);
  const [tab, setTab] = useState<Tab>('design');
  // A panel is mounted when first opened (Exports and Proofs load their code then) and kept, hidden, after.
  const [mounted, setMounted] = useState<ReadonlySet<Tab>>(() => new Set<Tab>(['design', 'table']));
  const openTab = (next: Tab) => {
    setTab(next);
    setMounted((panels) => (panels.has(next) ? panels : new Set([...panels, next])));
  };

  const validation = useMemo(() => {
    redrawStarted();
    return validateDraft(draft);
  }, [draft]);
  // While the form is invalid the drawing keeps the last valid design.
  const lastValid = useRef<Design>(initialDesign ?? blankDesign());
  if (validation.ok) lastValid.current = validation.design;
  const design = lastValid.current;
  const layout = useMemo(() => computeLayout(design), [design]);
  // The table, summary and warnings follow in a later, interruptible render, keeping typing and
  // redrawing quick.
  const settledLayout = useDeferredValue(layout);
  const settledDesign = useDeferredValue(design);

  useEffect(() => {
    if (loaded) return;
    let cancelled = false;
    store.load().then((kept) => {
      if (cancelled) return;
      if (kept) {
        setDraft(draftFromDesign(kept));
        setFitRequest((n) => n + 1);
      }
      setLoaded(true);
    });
    return () => {
      cancelled = true;
    };
  }, [loaded, store]);

  const autosave = useAutosave({
    store: editing ? store : null,
    boardId: opened?.id ?? null,
    version: opened?.version ?? 1,
    design,
    onSaved: useCallback((saved: BoardSummary) => setBoard(openBoard(saved)), []),
  });

  /** Shows a board as saved (just opened, restored, or taken after a conflict). */
  const showBoard = (saved: BoardDetail) => {
    const shown = showSaved(saved.design);
    if (!shown) return;
    autosave.adopt(saved, shown.design);
    setDraft(shown.draft);
    setBoard(openBoard(saved));
  };

  /** The editor now keeps `saved` (a scratch design just saved, or a copy after a conflict). */
  const switchToBoard = (saved: BoardDetail) => {
    setBoard(openBoard(saved));
    setOpened({ id: saved.id, version: saved.version });
    window.history.replaceState(null, '', `/layout?board=${saved.id}`);
  };

  const startFrom = (presetId: string) => {
    setDraft(draftFromDesign(presetId === BLANK_PRESET_ID ? blankDesign() : presetDesign(presetId)));
    setPickedFret(null);
    setFitRequest((n) => n + 1);
  };

  const tabs: TabItem<Tab>[] = [
    { id: 'design', label: 'Design' },
    { id: 'table', label: 'Fret table' },
    { id: 'exports', label: 'Exports' },
    ...(board ? [{ id: 'history', label: 'History' } as const, { id: 'proofs', label: 'Proofs' } as const] : []),
  ];

  const drawing = (
    <BoardDrawing
      layout={layout}
      outOfDate={!validation.ok}
      fitRequest={fitRequest}
      highlightedFret={hoveredFret ?? pickedFret}
      onHoverFret={setHoveredFret}
      onPickFret={setPickedFret}
      screenPxPerMm={screen.pxPerMm}
      describedBy={SUMMARY_ID}
      builderTools={!embedded}
    />
  );

  return (
    <div className="space-y-3">
      {/* Embedded in a client's page (a Proof), the builder's tools stay out. */}
      {!embedded && (
        <div role="toolbar" aria-label="Layout tools" className="flex flex-wrap items-center gap-x-4 gap-y-2 rounded border border-paper-line bg-white px-3 py-2 text-sm">
          <h1 className="mr-auto text-lg font-bold">{editing ? 'Layout' : design.name}</h1>
          {editing && (
            <div aria-label="Where this design is kept" role="group" className="flex flex-wrap items-center gap-2 text-xs">
              <span>{store.place}</span>
              <SaveStatusBadge state={autosave.state} />
              {autosave.state.status === 'error' && (
                <button type="button" className={BUTTON} onClick={autosave.saveNow}>Try saving again</button>
              )}
              {board ? (
                <>
                  <span>
                    {board.workingRevision === null ? (
                      <>Changes not yet in a revision (newest: <span className="font-mono">{board.currentRevision}</span>)</>
                    ) : (
                      <>Revision <span className="font-mono">{board.workingRevision}</span></>
                    )}{' '}
                    · <span className="font-mono" title="Fingerprint of this layout, as printed on its exports">{board.fingerprint}</span> · Status:{' '}
                    <strong data-board-status={board.status}>{STATUS_LABELS[board.status]}</strong>
                  </span>
                </>
              ) : (
                <>
                  {canSaveToBoards ? (
                    <SaveToBoardsButton design={design} onSaved={switchToBoard} />
                  ) : (
                    <span className="text-ink-soft">
                      <a href={`/sign-in?next=${encodeURIComponent('/layout')}`}>Sign in</a> as a builder or owner to save it to Boards.
                    </span>
                  )}
                </>
              )}
            </div>
          )}
          <button type="button" className={BUTTON} aria-expanded={calibrating} onClick={() => setCalibrating(!calibrating)}>
            Screen calibration
          </button>
          <a href="/safety" className="text-sm">Safety note: these layouts drive real saws and machines</a>
        </div>
      )}

      {calibrating && (
        <CalibrationPanel
          pxPerMm={screen.pxPerMm}
          calibrated={screen.calibrated}
          onClose={() => setCalibrating(false)}
          onSave={(pxPerMm) => {
            saveScreenPxPerMm(globalThis.localStorage, pxPerMm);
            setScreen({ pxPerMm, calibrated: true });
          }}
        />
      )}

      {board && (
        <BoardDetailsForm
          board={board}
          version={autosave.state.status === 'saved' ? autosave.state.version : null}
          onSaved={(saved) => {
            autosave.adopt(saved, design);
            setBoard(openBoard(saved));
          }}
        />
      )}

      {board && (
        <ApprovalNotice
          board={board}
          state={autosave.state}
          onKeep={autosave.confirmApprovalChange}
          onUndo={() => void fetchBoard(board.id).then(showBoard)}
        />
      )}

      {board && (
        <ConflictNotice
          state={autosave.state}
          mine={design}
          onReload={() => {
            const theirs = autosave.state.conflict?.current as BoardDetail | undefined;
            if (theirs) showBoard(theirs);
          }}
          onSaveAsCopy={() => void autosave.saveAsCopy().then(switchToBoard)}
        />
      )}

      <div className={editing ? 'grid gap-4 lg:grid-cols-[minmax(20rem,26rem)_minmax(0,1fr)]' : 'grid gap-4'}>
        <div className="order-1 min-w-0 space-y-3 lg:sticky lg:top-2 lg:order-2 lg:self-start">
          {drawing}
          <p id={SUMMARY_ID} className="text-xs text-ink-soft">{describeBoard(settledDesign, settledLayout)}</p>
          {settledLayout.warnings.length > 0 && (
            <section aria-label="Check before cutting" className="rounded border border-caution bg-caution-light p-2 text-sm">
              <h2 className="font-semibold">Check before cutting</h2>
              <ul className="list-disc pl-5">
                {settledLayout.warnings.map((warning) => <li key={`${warning.code}-${warning.fret}`}>{warning.message}</li>)}
              </ul>
            </section>
          )}
          <FretReadout layout={layout} fret={hoveredFret ?? pickedFret} />
        </div>
        {/* The side panel: every panel one tab away, the drawing staying in view beside it. */}
        <section
          aria-label={editing ? 'Design and board panels' : 'Fret table'}
          className={`order-2 min-w-0 space-y-2 ${editing ? 'lg:sticky lg:top-2 lg:order-1 lg:max-h-[calc(100vh-1rem)] lg:self-start lg:overflow-y-auto lg:pr-1' : ''}`}
        >
          {editing ? (
            <>
              <TabList label="Panels" idPrefix={TABS_ID} tabs={tabs} selected={tab} onSelect={openTab} className="sticky top-0 z-10 bg-paper" />
              <div {...tabPanelProps(TABS_ID, 'design', tab)}>
                <DesignForm draft={draft} onChange={setDraft} issues={validation.ok ? [] : validation.issues} presets={PRESETS} onStartFrom={startFrom} />
              </div>
              <div {...tabPanelProps(TABS_ID, 'table', tab)}>
                <FretTablePanel layout={settledLayout} design={settledDesign} boardId={board && autosave.state.status === 'saved' ? board.id : null} />
              </div>
              <div {...tabPanelProps(TABS_ID, 'exports', tab)}>
                {mounted.has('exports') && (
                  <div className="space-y-2">
                    {!validation.ok && (
                      <p className="rounded border border-caution bg-caution-light p-2 text-sm" role="status">
                        The form has errors: these exports are of the last valid layout, not what the form shows.
                      </p>
                    )}
                    <Suspense fallback={<p className="text-sm" role="status">Loading the exports…</p>}>
                      <ExportPanel design={design} board={board ? { ...board, ready: autosave.state.status === 'saved' } : null} />
                    </Suspense>
                  </div>
                )}
              </div>
              {board && (
                <div {...tabPanelProps(TABS_ID, 'history', tab)}>
                  {mounted.has('history') && (
                    <RevisionHistory
                      boardId={board.id}
                      version={autosave.state.version}
                      currentRevision={board.currentRevision}
                      workingRevision={board.workingRevision}
                      unsavedEdits={autosave.state.status !== 'saved'}
                      onRestored={showBoard}
                      onRevisionSaved={(saved) => setBoard(openBoard(saved))}
                    />
                  )}
                </div>
              )}
              {board && (
                <div {...tabPanelProps(TABS_ID, 'proofs', tab)}>
                  {mounted.has('proofs') && (
                    <Suspense fallback={<p className="text-sm" role="status">Loading the proofs…</p>}>
                      <ProofPanel boardId={board.id} />
                    </Suspense>
                  )}
                </div>
              )}
            </>
          ) : (
            <FretTablePanel layout={settledLayout} design={settledDesign} downloads={!embedded} />
          )}
        </section>
      </div>
    </div>
  );
}
