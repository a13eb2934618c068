import { readStudy, type Study, type StudyInput, type StudyProblem } from '../../engine/study/index.ts';
import { networkOf, type Network } from '../../engine/network/index.ts';
import { History } from './History.svelte.ts';
import { withItemAdded, withValueAt, withoutItemAt, valueAt, type DocumentPath } from '../lib/documentPath.ts';
import { pathOfSelection, type Selection } from '../lib/selection.ts';
import {
  newStudyDocument,
  newViewOf,
  withNewBranch,
  withNewMotor,
  withoutDevice,
  withoutMotor,
} from '../lib/newItems.ts';

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
  /** The id of the view on the sheet. */
  viewId: string | undefined = $state();
  /** The item whose properties are shown. */
  selection: Selection | undefined = $state();
  /** Problems of a file that was refused (the current study stays as it was). */
  refused: { fileName: string; problems: StudyProblem[] } | undefined = $state.raw();
  #lastGood: Study | undefined;

  /** The document being edited (file form). */
  readonly document = $derived.by(() => this.history.current);
  /** The document read with the engine's schema and tree rules. */
  readonly reading = $derived.by(() => readStudy(this.document));
  /** Problems of the document as it stands (empty when it is valid). */
  readonly problems = $derived.by(() => this.reading.problems);
  /** The parsed study: the current document's, or the last valid one while it has problems. */
  readonly study = $derived.by(() => {
    if (this.reading.study) this.#lastGood = this.reading.study;
    return this.reading.study ?? this.#lastGood;
  });
  /** The radial tree of `study`. */
  readonly network: Network | undefined = $derived.by(() => (this.study ? networkOf(this.study) : undefined));
  /** The view on the sheet (the chosen one, else the first). */
  readonly view = $derived.by(() => {
    const views = this.study?.views ?? [];
    return views.find((v) => v.id === this.viewId) ?? views[0];
  });
  /** True when the document differs from the last file opened or saved. */
  readonly dirty = $derived.by(() => this.document !== this.savedDocument);
  /** Where the selected item sits in the document. */
  readonly selectionPath = $derived.by(() => pathOfSelection(this.document, this.selection));

  constructor(document: StudyInput, fileName?: string) {
    this.history = new History(document);
    this.savedDocument = document;
    this.fileName = fileName;
  }

  /**
   * Sets one field and records it for undo. Edits of the same field in quick succession (typing,
   * arrow steps, a drag) are one undo step.
   */
  edit(path: DocumentPath, value: unknown, label: string): void {
    this.history.commit(withValueAt(this.document, path, value), label, { key: path.join('/') });
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
   * Opens a study from text. A file with problems is refused: `refused` lists them and the
   * current study, its history and its selection stay untouched. A good file replaces the study
   * once `confirmDiscard` (asked only then) agrees. Returns true when opened.
   */
  open(text: string, fileName: string, options: { confirmDiscard?: () => boolean } = {}): boolean {
    const { study, problems } = readStudy(text);
    if (!study) {
      this.refused = { fileName, problems };
      return false;
    }
    // Only a good file can replace the study, so only then is there anything to confirm.
    if (options.confirmDiscard && !options.confirmDiscard()) return false;
    this.load(JSON.parse(text) as StudyInput, fileName);
    return true;
  }

  /** Replaces the study with a valid document (a demo, a recovered autosave, a new study). */
  load(document: StudyInput, fileName?: string, options: { unsaved?: boolean; viewId?: string } = {}): void {
    this.history.reset(document);
    this.savedDocument = options.unsaved ? ({ ...document } as StudyInput) : document;
    this.fileName = fileName;
    this.viewId = options.viewId;
    this.selection = undefined;
    this.refused = undefined;
  }

  /** Starts an empty study: an infinite source feeding one 480 V bus. */
  newStudy(): void {
    this.load(newStudyDocument(), undefined);
  }

  /** The document is now the saved file. */
  markSaved(fileName: string): void {
    this.savedDocument = this.document;
    this.fileName = fileName;
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

  /** Deletes a device (and takes it off every view), or a motor with its device. */
  deleteItem(selection: Selection): void {
    if (selection.kind === 'device')
      this.history.commit(withoutDevice(this.document, selection.id), `delete ${selection.id}`);
    else if (selection.kind === 'motor')
      this.history.commit(withoutMotor(this.document, selection.id), `delete ${selection.id}`);
    else return;
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
