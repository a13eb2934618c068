import type { Study, StudyInput, StudyProblem } from '../../engine/study/index.ts';
import type { FaultLevels } from '../../engine/fault/index.ts';
import type { Network } from '../../engine/network/index.ts';
import { hasScenarios, scenariosOf } from '../../engine/scenario/index.ts';
import { History } from './History.svelte.ts';
import {
  builtStudyOf,
  editedReadingOf,
  networkOrUndefined,
  type BuiltStudy,
  type EditableReading,
} from '../lib/builtStudy.ts';
import { removalOf, withoutRemoval } from '../lib/removal.ts';
import { withItemAdded, withValueAt, withoutItemAt, valueAt, type DocumentPath } from '../lib/documentPath.ts';
import { COLLECTION_OF, pathOfSelection, selectionAfterIdEdit, type Selection } from '../lib/selection.ts';
import { idAfterStep, idEditOf } from '../lib/renaming.ts';
import { newStudyDocument, newViewOf, withNewBranch, withNewMotor } from '../lib/newItems.ts';

/** A study brought back from the browser's kept copies (shown in a banner until saved or replaced). */
export interface RecoveredFrom {
  /** When the copy was kept (ISO time). */
  savedAt: string;
  /** How many problems it had when it was restored. */
  problems: number;
}

/**
 * The study being worked on: the document exactly as the user wrote it (so saving round-trips
 * their units and wording), its undo history, what is selected, and the parsed study behind it.
 * While an edit leaves the document invalid, `study` keeps the last valid parse so the sheet stays
 * up and `problems` says what is wrong.
 *
 * @example const state = new StudyState(demo, 'harrowmere-selective.json'); state.edit(['devices', 0, 'rating'], '2000 A', 'rating of MAIN');
 */
export class StudyState {
  readonly history: History<StudyInput>;
  /** The file the study came from or was last saved to. */
  fileName: string | undefined = $state();
  /** The document as last opened or saved; `dirty` compares against it. */
  savedDocument: StudyInput = $state.raw() as StudyInput;
  /** How many studies have been shown since the workbench started: a view of the last one starts afresh when it moves. */
  opened = $state(0);
  /** The id of the view on the sheet. */
  viewId: string | undefined = $state();
  /** The id of the operating scenario shown (the first when unset or no longer in the study). */
  scenarioId: string | undefined = $state();
  /** The item whose properties are shown. */
  selection: Selection | undefined = $state();
  /** Problems of a file that was refused (the current study stays as it was). */
  refused: { fileName: string; problems: StudyProblem[] } | undefined = $state.raw();
  /** Set while the study on screen is one restored from a kept copy and not yet saved or replaced. */
  recovered: RecoveredFrom | undefined = $state.raw();
  #lastGood: Study | undefined;
  /** The last study built whole before it was shown (a load reuses its reading and network). */
  #built: BuiltStudy | undefined;
  /** The reading last made, which the next one reuses for what an edit left alone. */
  #lastReading: EditableReading | undefined;
  /**
   * For a document whose item id was left mid-typing (not a well-formed id, or another item's), the
   * id the rest of the document still names that item by: typing on to a good id renames from it.
   * Kept by document, so an undo or a redo back to that document finds it again.
   */
  #idsBeforeTyping = new WeakMap<StudyInput, ReadonlyMap<string, string>>();
  /** The sheet shown when each document stopped being current: an undo or a redo back to it shows it again. */
  #viewShown = new WeakMap<StudyInput, string | undefined>();

  /** The document being edited (file form). */
  readonly document = $derived.by(() => this.history.current);
  /**
   * The document read with the engine's schema and tree rules (never throws: a failure is a problem).
   * An edit (or an undo) is read from the reading before it: only the list items and fields it
   * changed go through the schema again.
   */
  readonly reading = $derived.by(() => {
    const document = this.document;
    const reading =
      this.#built?.document === document ? this.#built.reading : editedReadingOf(this.#lastReading, document);
    this.#lastReading = reading;
    return reading;
  });
  /** Problems of the document as it stands (empty when it is valid). */
  readonly problems = $derived.by(() => this.reading.problems);
  /** The parsed study: the current document's, or the last valid one while it has problems. */
  readonly study = $derived.by(() => {
    if (this.reading.study) this.#lastGood = this.reading.study;
    return this.reading.study ?? this.#lastGood;
  });
  /** The radial tree of `study`. */
  readonly network: Network | undefined = $derived.by(() => {
    const study = this.study;
    if (!study) return undefined;
    return this.#built?.reading.study === study ? this.#built.network : networkOrUndefined(study);
  });

  /**
   * The fault levels worked out when the study was opened, for the network built then (`undefined` for
   * any other): opening builds the study whole before showing it, and they need not be worked out again.
   */
  builtFaults(network: Network): FaultLevels | undefined {
    return this.#built?.network === network ? this.#built.faults : undefined;
  }
  /** The view on the sheet (the chosen one, else the first). */
  readonly view = $derived.by(() => {
    const views = this.study?.views ?? [];
    return views.find((v) => v.id === this.viewId) ?? views[0];
  });
  /** The study's operating scenarios, for a study with generators, switches or scenarios; else none. */
  readonly scenarios = $derived.by(() => {
    const study = this.study;
    return study && hasScenarios(study) ? scenariosOf(study) : [];
  });
  /** The scenario shown in the tree, the sheet, the findings and the one-line diagram (none for a plain study). */
  readonly scenario = $derived.by(() => this.scenarios.find((s) => s.id === this.scenarioId) ?? this.scenarios[0]);
  /** True when the document differs from the last file opened or saved. */
  readonly dirty = $derived.by(() => this.document !== this.savedDocument);
  /** Where the selected item sits in the document. */
  readonly selectionPath = $derived.by(() => pathOfSelection(this.document, this.selection));

  constructor(document: StudyInput, fileName?: string) {
    // Read once here, so the first parse is also the last good one an invalid edit falls back on.
    const built = builtStudyOf(document);
    if (built.ok) {
      this.#built = built.value;
      this.#lastGood = built.value.reading.study;
    }
    this.history = new History(document);
    this.history.onleave = (left, next, how) => {
      this.#viewShown.set(left, this.view?.id);
      // Ids left half-typed are still remembered after any other edit (a name, another id, a setting
      // the Window tab wrote): typing on renames their references from the id they used.
      // They are kept by place: one whose item the edit moved (an item added or taken away before it) is forgotten.
      const typing = this.#idsBeforeTyping.get(left);
      if (how !== 'commit' || !typing || this.#idsBeforeTyping.has(next)) return;
      const staying = [...typing].filter(([field]) => inPlace(left, next, field));
      // eslint-disable-next-line svelte/prefer-svelte-reactivity -- a value kept with one document, never changed
      if (staying.length > 0) this.#idsBeforeTyping.set(next, new Map(staying));
    };
    this.savedDocument = document;
    this.fileName = fileName;
  }

  /**
   * Sets one field and records it for undo. Edits of the same field in quick succession (typing,
   * arrow steps, a drag) are one undo step. An item's id renames the item everywhere the document
   * names it once it is a good id of its own, and the selection follows it (see `idEditOf`).
   */
  edit(path: DocumentPath, value: unknown, label: string): void {
    const field = path.join('/');
    const remembered = this.#idsBeforeTyping.get(this.document);
    const idEdit = idEditOf(this.document, path, value, remembered?.get(field));
    if (!idEdit) {
      this.history.commit(withValueAt(this.document, path, value), label, { key: field });
      return;
    }
    const selected = this.selectionPath;
    const wasSelected = selected !== undefined && selected.join('/') === path.slice(0, -1).join('/');
    this.history.commit(idEdit.document, label, { key: field });
    // The ids still half-typed, each with the id its references use: this one kept or forgotten.
    const others = [...(this.#idsBeforeTyping.get(idEdit.document) ?? remembered ?? [])].filter(([f]) => f !== field);
    const typing = !idEdit.renamed && idEdit.knownAs !== undefined ? [[field, idEdit.knownAs] as const] : [];
    // eslint-disable-next-line svelte/prefer-svelte-reactivity -- a value kept with one document, never changed
    this.#idsBeforeTyping.set(idEdit.document, new Map([...others, ...typing]));
    // The editor stays on the item: by its new id, or by its place while the id is not its own yet.
    if (wasSelected && this.selection)
      this.selection = selectionAfterIdEdit(this.selection, path, value, idEdit.renamed);
    if (!idEdit.renamed || idEdit.wasKnownAs === undefined) return;
    if (path[0] === 'views' && this.viewId === idEdit.wasKnownAs) this.viewId = idEdit.knownAs;
    if (path[0] === 'scenarios' && this.scenarioId === idEdit.wasKnownAs) this.scenarioId = idEdit.knownAs;
  }

  /** Undoes the last edit; the selection, the sheet shown and the scenario chosen follow a rename it undoes. */
  undo(): void {
    this.#step(() => this.history.undo());
  }

  /** Redoes the edit last undone; the selection, sheet and scenario follow a rename it redoes. */
  redo(): void {
    this.#step(() => this.history.redo());
  }

  #step(step: () => void): void {
    const before = this.document;
    step();
    const after = this.document;
    const selection = this.selection;
    if (selection && selection.kind !== 'source') {
      const list = COLLECTION_OF[selection.kind];
      // Where the step kept the list's length (an id typed, undone or redone), the item is followed by
      // its place, which its id, half-typed or another's, may not tell; else by its id.
      // (by its id only where that id is its own: two items may share a half-typed one)
      const at =
        selection.at ?? (isOwnId(before, list, selection.id) ? pathOfSelection(before, selection)?.[1] : undefined);
      const atPlace =
        typeof at === 'number' && sameListLengths(before, after) ? valueAt(after, [list, at, 'id']) : undefined;
      if (typeof atPlace === 'string') {
        // A new selection only when it changed: the panels bring a new one into view.
        const next = selectionAfterStep(after, list, selection.kind, at as number, atPlace);
        if (next.id !== selection.id || next.at !== selection.at) this.selection = next;
      } else {
        const id = idAfterStep(before, after, list, selection.id);
        if (id !== undefined && id !== selection.id) this.selection = { kind: selection.kind, id };
      }
    }
    // The sheet shown when `after` was last current comes back with it (the one a new sheet or a
    // deletion moved away from); else the one shown follows a rename.
    const shown = this.#viewShown.get(after);
    if (shown !== undefined && (after.views ?? []).some((view) => view.id === shown)) this.viewId = shown;
    else if (this.viewId !== undefined) this.viewId = idAfterStep(before, after, 'views', this.viewId) ?? this.viewId;
    if (this.scenarioId !== undefined)
      this.scenarioId = idAfterStep(before, after, 'scenarios', this.scenarioId) ?? this.scenarioId;
  }

  /** Appends an item to a list of the document (a device to a view, a new view). */
  addItem(path: DocumentPath, item: unknown, label: string): void {
    this.history.commit(withItemAdded(this.document, path, item), label);
  }

  /** Removes the list item at `path`. */
  removeItem(path: DocumentPath, label: string): void {
    this.history.commit(withoutItemAt(this.document, path), label);
  }

  /** Reads a field of the document as written. */
  valueAt(path: DocumentPath): unknown {
    return valueAt(this.document, path);
  }

  /**
   * Opens a study from text, all or nothing: the whole new study (reading, network, tree, fault
   * levels, bands) is built first and only then shown. A file with problems, or one that cannot be
   * built, is refused: `refused` says why and the current study, its history and its selection stay
   * untouched. A good file replaces the study once `confirmDiscard` (asked only then) agrees.
   * Returns true when opened.
   */
  open(text: string, fileName: string, options: { confirmDiscard?: () => boolean } = {}): boolean {
    // Read from the text itself, by the command line's rules (byte-order mark, fields given twice, nesting).
    const built = builtStudyOf(text);
    if (!built.ok) {
      this.refused = { fileName, problems: built.problems };
      return false;
    }
    // Only a good file can replace the study, so only then is there anything to confirm.
    if (options.confirmDiscard && !options.confirmDiscard()) return false;
    this.#show(built.value, fileName, {});
    return true;
  }

  /**
   * Replaces the study with a valid document (a demo, a new study), built whole first. A document
   * that cannot be built is refused like a file (`refused`, under `fileName` or its name) and the
   * current study stays. Returns true when shown.
   */
  load(document: StudyInput, fileName?: string, options: { unsaved?: boolean; viewId?: string } = {}): boolean {
    const built = builtStudyOf(document);
    if (!built.ok) {
      this.refused = { fileName: fileName ?? String(document?.name ?? 'the study'), problems: built.problems };
      return false;
    }
    this.#show(built.value, fileName, options);
    return true;
  }

  /**
   * Brings back a kept copy exactly as it was kept, problems and all (a field cleared to retype it
   * stays cleared, and the problems bar says so). A copy that reads as a study is built whole first;
   * when that fails the current study stays and `refused` says why. Returns true when shown.
   */
  restore(
    document: StudyInput,
    kept: { fileName?: string; viewId?: string; unsaved: boolean; savedAt: string },
  ): boolean {
    const built = builtStudyOf(document);
    const reading = built.ok ? built.value : undefined;
    const hasProblems = !built.ok && built.problems.length > 0 && !built.failed;
    if (!reading && !hasProblems) {
      this.refused = { fileName: kept.fileName ?? 'the kept copy', problems: built.ok ? [] : built.problems };
      return false;
    }
    this.#show(reading ?? { document, reading: { problems: built.ok ? [] : built.problems } }, kept.fileName, {
      unsaved: kept.unsaved,
      viewId: kept.viewId,
    });
    this.recovered = { savedAt: kept.savedAt, problems: reading ? 0 : this.problems.length };
    return true;
  }

  /** Swaps in a study built whole: document, history, file name, view, selection, in one step. */
  #show(built: BuiltStudy, fileName: string | undefined, options: { unsaved?: boolean; viewId?: string }): void {
    this.#built = built;
    this.#lastGood = built.reading.study;
    const document = built.document;
    this.history.reset(document);
    this.savedDocument = options.unsaved ? ({ ...document } as StudyInput) : document;
    this.fileName = fileName;
    this.opened++;
    this.viewId = options.viewId;
    this.scenarioId = undefined;
    this.selection = undefined;
    this.refused = undefined;
    this.recovered = undefined;
  }

  /** Starts an empty study: an infinite source feeding one 480 V bus. */
  newStudy(): void {
    this.load(newStudyDocument(), undefined);
  }

  /** The document is now the saved file. */
  markSaved(fileName: string): void {
    this.savedDocument = this.document;
    this.fileName = fileName;
    this.recovered = undefined;
  }

  /** Adds a device to the current view (when it is not on it yet). */
  addDeviceToView(deviceId: string): void {
    const index = this.#viewIndex();
    if (index < 0) return;
    const devices = valueAt(this.document, ['views', index, 'devices']);
    if (Array.isArray(devices) && devices.includes(deviceId)) return;
    this.addItem(['views', index, 'devices'], deviceId, `add ${deviceId} to the sheet`);
  }

  /** Takes a device off the current view (a view keeps at least one device). */
  removeDeviceFromView(deviceId: string): void {
    const index = this.#viewIndex();
    const devices = valueAt(this.document, ['views', index, 'devices']);
    if (!Array.isArray(devices) || devices.length < 2) return;
    const at = devices.indexOf(deviceId);
    if (at >= 0) this.removeItem(['views', index, 'devices', at], `take ${deviceId} off the sheet`);
  }

  /** Creates a view showing `deviceId` and the devices above it, on that device's voltage, and shows it. */
  newView(deviceId: string): void {
    if (!this.study || !this.network) return;
    const view = newViewOf(this.document, this.network, deviceId);
    if (!view) return;
    this.addItem(['views'], view, `new sheet ${view.id}`);
    this.viewId = view.id;
  }

  /** Adds a cable or a transformer from a bus to a new bus, and selects the new branch. */
  addBranch(busId: string, kind: 'cable' | 'transformer'): void {
    const volts = this.network?.buses.get(busId)?.voltage;
    if (volts === undefined) return;
    const next = withNewBranch(this.document, busId, kind, volts);
    const added = kind === 'cable' ? next.cables?.at(-1) : next.transformers?.at(-1);
    this.history.commit(next, `add ${kind} ${added?.id} below ${busId}`);
    if (added) this.selection = { kind, id: added.id };
  }

  /** Adds a motor on a bus and selects it. */
  addMotor(busId: string): void {
    const next = withNewMotor(this.document, busId);
    const added = next.motors?.at(-1);
    this.history.commit(next, `add motor ${added?.id} on ${busId}`);
    if (added) this.selection = { kind: 'motor', id: added.id };
  }

  /**
   * Deletes a bus, transformer, cable, motor or device with everything it takes (its device, what
   * hangs below, switches and generators left on nothing, its places on views and in scenarios: see
   * `removalOf`), as one undo step.
   */
  deleteItem(selection: Selection): void {
    const removal = removalOf(this.document, selection);
    if (!removal) return;
    this.history.commit(withoutRemoval(this.document, removal), `delete ${selection.kind} ${selection.id}`);
    this.selection = undefined;
  }

  /** Deletes the current view (the study's other views stay) and shows the first remaining one. */
  deleteView(): void {
    const index = this.#viewIndex();
    if (index < 0) return;
    this.removeItem(['views', index], `delete sheet ${this.view?.id}`);
    this.viewId = undefined;
  }

  #viewIndex(): number {
    const views = valueAt(this.document, ['views']);
    const id = this.view?.id;
    return Array.isArray(views) ? views.findIndex((v) => v?.id === id) : -1;
  }
}

/** The selection of the item at `at` of `list` after an undo or a redo: by its id where that is its own, else by its place too. */
function selectionAfterStep(
  document: StudyInput,
  list: string,
  kind: Selection['kind'],
  at: number,
  id: string,
): Selection {
  return isOwnId(document, list, id) ? { kind, id } : { kind, id, at };
}

/** The lists whose items are held by their place (elements, sheets, scenarios). */
const PLACED_LISTS = [
  'buses',
  'transformers',
  'cables',
  'motors',
  'devices',
  'switches',
  'generators',
  'views',
  'scenarios',
];

/** Whether two versions of a document have as many items in each list: no item added or taken away. */
function sameListLengths(a: StudyInput, b: StudyInput): boolean {
  const lengthOf = (document: StudyInput, list: string) => {
    const items = valueAt(document, [list]);
    return Array.isArray(items) ? items.length : 0;
  };
  return PLACED_LISTS.every((list) => lengthOf(a, list) === lengthOf(b, list));
}

/**
 * Whether the item whose field is `field` ("devices/1/id") stands at the same place after an edit: its
 * list kept its length, or the item there is the very object it was (the edit touched nothing before it).
 */
function inPlace(left: StudyInput, next: StudyInput, field: string): boolean {
  const [list, index] = field.split('/');
  const [was, now] = [valueAt(left, [list]), valueAt(next, [list])];
  if (!Array.isArray(was) || !Array.isArray(now)) return false;
  return was.length === now.length || was[Number(index)] === now[Number(index)];
}

/** Whether exactly one item of a list goes by `id`. */
function isOwnId(document: StudyInput, list: string, id: string): boolean {
  const items = valueAt(document, [list]);
  return Array.isArray(items) && items.filter((item) => (item as { id?: unknown } | null)?.id === id).length === 1;
}
