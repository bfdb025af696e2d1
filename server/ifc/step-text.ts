/**
 * Reads entity lines straight from the STEP text of the file, in the raw form web-ifc's wasm
 * hands to its own line constructors (FromRawLineData), so the line objects the extractors see
 * are the same objects web-ifc's GetLine builds — without its per-line cost. GetLine spends
 * about 7 µs per line inside the wasm and its JavaScript bindings; building the object from
 * raw arguments costs about 0.5 µs, and tokenising one line here about as much.
 *
 * web-ifc's schema decides what a line is (a line whose name web-ifc does not know is not read
 * here either, see ModelContext), and web-ifc stays the reader of every line this tokeniser
 * does not handle exactly like web-ifc: strings with escapes or bytes above 127, comments inside a
 * line, complex entity instances, duplicate ids, a statement cut off by the end of the file.
 * For those, raw() answers DEFER and the caller asks web-ifc.
 *
 * The index is one pass over the bytes: the offset of every `#id=` statement, by express id.
 */

/** raw() cannot read this line exactly as web-ifc would; ask web-ifc. */
export const DEFER = Symbol('defer');

/** The second part of a text indexed in two threads (StepText.indexRest → finishFrom). */
export interface StepTextRest {
  /** Where that part's scan began. */
  from: number;
  offsets: Uint32Array;
  sparse: [number, number][];
  exact: boolean;
  cutOrCommented: number;
  stray: number;
  /** Each name met in the part: one occurrence in the file, its hash, and its ids in file order. */
  names: { start: number; length: number; hash: number; ids: Uint32Array }[];
}

/** A regular text's index as StepText.snapshot gives it to another thread. */
export interface StepTextIndex {
  size: number;
  /** Offset + 1 of each id's entity name (StepText's dense offsets), in shared memory. */
  offsets: Uint32Array;
  /** Ids beyond the dense offsets, with their offset + 1. */
  sparse: [number, number][];
  /** Per type: its code, the count of its ids, then the ids in file order; in shared memory. */
  lists: Uint32Array;
}

/** The raw line as web-ifc's wasm returns it: arguments as {type, value} tokens. */
export interface RawLine {
  ID: number;
  type: number;
  arguments: unknown[];
}

// Token kinds of web-ifc's tape (the `type` of a raw argument).
const STRING = 1;
const LABEL = 2; // typed value, e.g. IFCLABEL('x'), with its type code
const ENUM = 3;
const REAL = 4;
const REF = 5;
const INTEGER = 10;

const HASH = 0x23;
const EQ = 0x3d;
const SEMI = 0x3b;
const QUOTE = 0x27;
const SLASH = 0x2f;
const STAR = 0x2a;
const LPAREN = 0x28;
const RPAREN = 0x29;
const COMMA = 0x2c;
const DOLLAR = 0x24;
const DOT = 0x2e;
const BACKSLASH = 0x5c;

const KEYWORD_DATA = new TextEncoder().encode('DATA');
const KEYWORD_ENDSEC = new TextEncoder().encode('ENDSEC');
const KEYWORD_END = new TextEncoder().encode('END-ISO-10303-21');

const NO_OFFSET = 0;
const DEFERRED = 0xffffffff;
/** Ids above this (or above the file length) go into a Map instead of the offset array. */
const DENSE_LIMIT = 64_000_000;

const MAX_EXACT = 2 ** 53;
const NO_IDS: readonly number[] = [];
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/** A name as written, web-ifc's code for it, and the ids of the lines written with it (file order). */
interface NameEntry {
  bytes: Uint8Array;
  /** Where the name was first met in the file (another thread's part names it by this). */
  start: number;
  hash: number;
  code: number;
  ids: number[] | null;
}

class Defer extends Error {}
const defer = new Defer('defer');
/** Marks an omitted ('*', derived) argument, which web-ifc leaves out of the raw arguments. */
const OMITTED = Symbol('omitted');

function isSpace(c: number): boolean {
  return c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09;
}

function isDigit(c: number): boolean {
  return c >= 0x30 && c <= 0x39;
}

export class StepText {
  /** Offset + 1 of the entity name after `#id=`; 0 when absent; DEFERRED when web-ifc must read it. */
  private offsets: Uint32Array;
  private sparse = new Map<number, number>();
  private readonly text: Buffer;
  private pos = 0;
  /** Type codes of the names met so far, by a hash of their bytes. */
  private readonly names = new Map<number, NameEntry[]>();

  private constructor(
    private readonly bytes: Uint8Array,
    offsets: Uint32Array,
    /** Type code of an entity or type name in capitals (web-ifc's GetTypeCodeFromName); 0 when unknown. */
    private readonly codeOf: (name: string) => number,
  ) {
    this.offsets = offsets;
    this.text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }

  /** One pass over the bytes: where each `#id=` statement starts. */
  static index(bytes: Uint8Array, codeOf: (name: string) => number): StepText {
    const self = new StepText(bytes, new Uint32Array(1024), codeOf);
    self.scanned = self.scan(0, bytes.length);
    return self;
  }

  /** How far the scan has come (the file's length once indexed). */
  private scanned = 0;

  /**
   * Where another thread may index the rest of the file (indexRest) while this one indexes up
   * to it (indexUpTo): a `#` starting a line after a `;`, past the middle. Only a guess — a
   * string may hold such bytes — which finishFrom checks. Null when there is none.
   */
  static splitPoint(bytes: Uint8Array): number | null {
    const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    // Lines may end in \n or \r\n.
    for (let at = text.indexOf('\n#', bytes.length >> 1, 'latin1'); at > 0; at = text.indexOf('\n#', at + 1, 'latin1')) {
      if (bytes[at - 1] === SEMI || (bytes[at - 1] === 0x0d && bytes[at - 2] === SEMI)) return at + 1;
    }
    return null;
  }

  /** Indexes the statements that start before `to`; finishFrom completes the index. */
  static indexUpTo(bytes: Uint8Array, to: number, codeOf: (name: string) => number): StepText {
    const self = new StepText(bytes, new Uint32Array(1024), codeOf);
    self.scanned = self.scan(0, to);
    return self;
  }

  /** The statements from `from` (a statement start inside DATA) to the end, indexed for another thread's StepText. */
  static indexRest(bytes: Uint8Array, from: number, codeOf: (name: string) => number): StepTextRest {
    const part = new StepText(bytes, new Uint32Array(1024), codeOf);
    part.inData = true;
    part.scan(from, bytes.length);
    const names: StepTextRest['names'] = [];
    for (const entries of part.names.values()) for (const e of entries) if (e.ids) names.push({ start: e.start, length: e.bytes.length, hash: e.hash, ids: Uint32Array.from(e.ids) });
    return { from, offsets: part.offsets, sparse: [...part.sparse], exact: part.exact, cutOrCommented: part.cutOrCommented, stray: part.stray, names };
  }

  /**
   * Completes an index begun by indexUpTo with the rest another thread indexed, when this scan
   * ended exactly where that one began, inside DATA (then both read the statements a single scan
   * would); else scans the rest here. Ids are merged as a single scan records them, repeats included.
   */
  finishFrom(rest: StepTextRest | null): void {
    const n = this.bytes.length;
    if (this.scanned >= n) return;
    if (!rest || rest.from !== this.scanned || !this.inData) {
      this.scanned = this.scan(this.scanned, n);
      return;
    }
    this.mergeOffsets(rest.offsets);
    for (const [id, value] of rest.sparse) this.recordValue(id, value);
    if (!rest.exact) this.exact = false;
    this.cutOrCommented += rest.cutOrCommented;
    this.stray += rest.stray;
    for (const { start, length, hash, ids } of rest.names) {
      const entry = this.nameEntry(hash, start, start + length);
      const list = (entry.ids ??= []);
      for (let k = 0; k < ids.length; k++) list.push(ids[k]);
    }
    this.scanned = n;
  }

  /** recordValue for every id of another part's dense offsets, without a call per id (a million or more). */
  private mergeOffsets(other: Uint32Array): void {
    if (other.length > this.offsets.length) {
      const grown = new Uint32Array(other.length);
      grown.set(this.offsets);
      this.offsets = grown;
    }
    const mine = this.offsets;
    for (let id = 0; id < other.length; id++) {
      const value = other[id];
      if (value === NO_OFFSET) continue;
      if (mine[id] === NO_OFFSET) {
        mine[id] = value;
        this.size++;
      } else {
        mine[id] = DEFERRED;
        this.exact = false;
      }
    }
  }

  /**
   * The index of a regular text in memory another thread can read, so that it reads the same
   * bytes without scanning them again (reader-thread.ts): offsets, and per type its code, count
   * and ids. Null for irregular text, which is read in one thread.
   */
  snapshot(): StepTextIndex | null {
    if (!this.regular) return null;
    const offsets = new Uint32Array(new SharedArrayBuffer(this.offsets.byteLength));
    offsets.set(this.offsets);
    const byType = this.lists().byType;
    let words = 0;
    for (const ids of byType.values()) words += 2 + ids.length;
    const lists = new Uint32Array(new SharedArrayBuffer(words * 4));
    let k = 0;
    for (const [code, ids] of byType) {
      lists[k++] = code;
      lists[k++] = ids.length;
      for (const id of ids) lists[k++] = id;
    }
    return { size: this.size, offsets, sparse: [...this.sparse], lists };
  }

  /** A text indexed by another thread (snapshot): the same reads, without the scan. */
  static adopt(bytes: Uint8Array, index: StepTextIndex, codeOf: (name: string) => number): StepText {
    const self = new StepText(bytes, index.offsets, codeOf);
    self.size = index.size;
    self.sparse = new Map(index.sparse);
    self.byType = new Map();
    const { lists } = index;
    // Each list becomes an array when first asked for: a reader asks for a few dozen types.
    for (let k = 0; k < lists.length; k += 2 + lists[k + 1]) self.adoptedLists.set(lists[k], lists.subarray(k + 2, k + 2 + lists[k + 1]));
    return self;
  }

  private readonly adoptedLists = new Map<number, Uint32Array>();

  /** Distinct express ids found in the text. */
  size = 0;

  /**
   * The lists hold every line under the type web-ifc gives it: false once a line's type cannot
   * be read from its name (complex instances, a statement without one), an id is repeated, or
   * one type is written in two spellings (their lines could not be put back in file order).
   */
  get listsExact(): boolean {
    return this.lists().exact;
  }

  /**
   * Every statement ends before the end of the file and holds no comment, and the lists are
   * exact: nothing of the text is left to web-ifc but single values this tokeniser defers.
   */
  get regular(): boolean {
    return this.cutOrCommented === 0 && this.stray === 0 && this.listsExact;
  }

  /** Statements cut off by the end of the file or holding a comment (web-ifc reads them). */
  private cutOrCommented = 0;
  /** Statements in a DATA section that are not `#id=` lines nor the section's end (garbage). */
  private stray = 0;
  private inData = false;

  /** Notes a statement without `#id=` starting at s: the DATA keyword, a section's end, or stray. */
  private statementWithoutId(s: number): void {
    if (this.startsWith(s, KEYWORD_DATA)) this.inData = true;
    else if (this.inData && !this.startsWith(s, KEYWORD_ENDSEC) && !this.startsWith(s, KEYWORD_END)) this.stray++;
  }

  private startsWith(s: number, word: Uint8Array): boolean {
    for (let k = 0; k < word.length; k++) if (this.bytes[s + k] !== word[k]) return false;
    return true;
  }

  private exact = true;
  private byType: Map<number, number[]> | null = null;

  /** Ids of the lines of exactly this type, in file order, as web-ifc lists them (only meaningful while listsExact). */
  idsOfType(code: number): readonly number[] {
    const byType = this.lists().byType;
    let ids = byType.get(code);
    const adopted = ids ? undefined : this.adoptedLists.get(code);
    if (adopted) byType.set(code, (ids = Array.from(adopted)));
    return ids ?? NO_IDS;
  }

  /** The lists by type code, gathered from the names' entries once the scan is done. */
  private lists(): { exact: boolean; byType: Map<number, number[]> } {
    if (!this.byType) {
      this.byType = new Map();
      for (const entries of this.names.values()) {
        for (const e of entries) {
          if (!e.ids || e.code <= 0) continue;
          if (this.byType.has(e.code)) this.exact = false;
          else this.byType.set(e.code, e.ids);
        }
      }
    }
    return { exact: this.exact, byType: this.byType };
  }

  /** Files the line's id under the name it is written with (names web-ifc does not know are listed nowhere). */
  private fileUnderType(id: number, start: number): void {
    const end = this.nameEnd(start);
    if (end === start) {
      this.exact = false;
      return;
    }
    const entry = this.nameEntry(this.nameHash, start, end);
    if (entry.ids) entry.ids.push(id);
    else entry.ids = [id];
  }

  /** Hash of the name last scanned by nameEnd. */
  private nameHash = 0;

  /** End of the entity or type name (letters, digits, '_') starting at s; its hash is left in nameHash. */
  private nameEnd(s: number): number {
    const b = this.bytes;
    let i = s;
    let h = 0;
    for (;;) {
      const c = b[i];
      if ((c >= 0x41 && c <= 0x5a) || (c >= 0x61 && c <= 0x7a) || isDigit(c) || c === 0x5f) {
        h = (Math.imul(h, 31) + c) | 0;
        i++;
      } else break;
    }
    this.nameHash = h;
    return i;
  }

  /** offset null: the statement is there but web-ifc must read it. */
  private record(id: number, offset: number | null): void {
    this.recordValue(id, offset === null || offset + 1 >= DEFERRED ? DEFERRED : offset + 1);
  }

  /** Records an id with its stored value (offset + 1, or DEFERRED); a repeated id is DEFERRED. */
  private recordValue(id: number, stored: number): void {
    const dense = id < DENSE_LIMIT && id <= this.bytes.length;
    if (dense && id >= this.offsets.length) {
      let len = this.offsets.length;
      while (len <= id) len *= 2;
      const grown = new Uint32Array(Math.min(len, DENSE_LIMIT));
      grown.set(this.offsets);
      this.offsets = grown;
    }
    const previous = dense ? this.offsets[id] : (this.sparse.get(id) ?? NO_OFFSET);
    if (previous === NO_OFFSET) this.size++;
    else this.exact = false;
    // A repeated id is read the way web-ifc reads it, whichever that is.
    const value = previous !== NO_OFFSET ? DEFERRED : stored;
    if (dense) this.offsets[id] = value;
    else this.sparse.set(id, value);
  }

  /** Indexes the statements starting at `from` up to the first one starting at or after `to`; returns where it stopped. */
  private scan(from: number, to: number): number {
    const b = this.bytes;
    const text = this.text;
    const n = b.length;
    let i = from;
    // Next ';', quote and '/' at or after the statement being read (-1: none left in the file).
    let semi = text.indexOf(SEMI, from);
    let quote = text.indexOf(QUOTE, from);
    let slash = text.indexOf(SLASH, from);
    while (i < to) {
      // Start of a statement: skip blanks and comments.
      let c = b[i];
      while (i < n && (isSpace(c) || (c === SLASH && b[i + 1] === STAR))) {
        if (c === SLASH) {
          i += 2;
          while (i < n && !(b[i] === STAR && b[i + 1] === SLASH)) i++;
          i += 2;
        } else i++;
        c = b[i];
      }
      if (i >= to) break;
      let id = -1;
      let start = -1;
      if (c === HASH) {
        let j = i + 1;
        let v = 0;
        while (j < n && isDigit(b[j])) v = v * 10 + (b[j++] - 0x30);
        if (j > i + 1) {
          while (j < n && isSpace(b[j])) j++;
          if (b[j] === EQ) {
            j++;
            while (j < n && isSpace(b[j])) j++;
            id = v;
            start = j;
            i = j;
          }
        }
      }
      if (id < 0) this.statementWithoutId(i);
      // To the end of the statement: a ';' outside strings. Buffer.indexOf (memchr) finds the
      // next ';', quote and '/' far faster than a loop over every byte; the positions found
      // are kept while they still lie ahead.
      let clean = true;
      for (;;) {
        if (semi >= 0 && semi < i) semi = text.indexOf(SEMI, i);
        if (semi < 0) {
          i = n;
          break;
        }
        if (quote >= 0 && quote < i) quote = text.indexOf(QUOTE, i);
        if (slash >= 0 && slash < i) slash = text.indexOf(SLASH, i);
        const stop = quote >= 0 && quote < semi ? quote : semi;
        if (slash >= 0 && slash < stop && b[slash + 1] === STAR) {
          // A comment inside the statement: web-ifc reads this line.
          clean = false;
          const close = text.indexOf('*/', slash + 2);
          i = close < 0 ? n : close + 2;
          continue;
        }
        if (stop === semi) {
          i = semi;
          break;
        }
        // A string: skip to its closing quote ('' is an empty string next to it, which works out the same).
        const close = text.indexOf(QUOTE, quote + 1);
        if (close < 0) {
          i = n;
          break;
        }
        i = close + 1;
      }
      if (id >= 0) {
        if (clean && i < n) this.record(id, start);
        else {
          this.record(id, null); // cut off by the end of the file, or holds a comment
          this.cutOrCommented++;
        }
        this.fileUnderType(id, start);
      }
      i++;
    }
    return i;
  }

  private offsetOf(id: number): number {
    return id < this.offsets.length ? this.offsets[id] : (this.sparse.get(id) ?? NO_OFFSET);
  }

  /** The raw line; null when the text has no such id; DEFER when web-ifc must read it. */
  raw(id: number): RawLine | null | typeof DEFER {
    // Leaves pos at the argument list's '('.
    const type = this.typeCodeOf(id);
    if (type === null || type === DEFER) return type;
    try {
      const args = this.list(true);
      this.end();
      return { ID: id, type, arguments: args };
    } catch (e) {
      if (e === defer) return DEFER;
      throw e;
    }
  }

  /**
   * The express ids in argument `index` of a line named `name` (as written in capitals): a
   * reference gives one id, a list of references its ids, '$' none — what refs() of the
   * attribute of web-ifc's line object gives (`single`: only a reference or '$' is read here). No line object is built; the arguments before it
   * are skipped over. Anything else there (or another name) answers DEFER: read the line.
   * For the relationship lines, which are a tenth of a model and only their references matter.
   */
  handles(id: number, name: Uint8Array, index: number, single = false): number[] | typeof DEFER {
    const b = this.bytes;
    try {
      if (!this.seekArgument(id, name, index)) return DEFER;
      const c = b[this.pos];
      if (c === DOLLAR) return [];
      if (c === HASH) {
        this.pos++;
        const s = this.pos;
        const v = this.integer();
        return this.pos === s ? DEFER : [v];
      }
      // A list where one reference is expected: ref() of web-ifc's object decides (undefined).
      if (c !== LPAREN || single) return DEFER;
      this.pos++;
      const out: number[] = [];
      this.skipSpace();
      if (b[this.pos] === RPAREN) return out;
      for (;;) {
        this.skipSpace();
        if (b[this.pos] !== HASH) return DEFER;
        this.pos++;
        const s = this.pos;
        out.push(this.integer());
        if (this.pos === s) return DEFER;
        this.skipSpace();
        const d = b[this.pos++];
        if (d === RPAREN) return out;
        if (d !== COMMA) return DEFER;
      }
    } catch (e) {
      if (e === defer) return DEFER;
      throw e;
    }
  }

  /**
   * The type code of the line as raw() would give it, without reading its arguments; null when
   * the text has no such id, DEFER when web-ifc must read it.
   */
  typeCodeOf(id: number): number | null | typeof DEFER {
    const off = this.offsetOf(id);
    if (off === NO_OFFSET) return null;
    if (off === DEFERRED) return DEFER;
    this.pos = off - 1;
    try {
      const type = this.typeCode();
      return type === 0 || this.bytes[this.pos] !== LPAREN ? DEFER : type;
    } catch (e) {
      if (e === defer) return DEFER;
      throw e;
    }
  }

  /**
   * Moves pos to argument `index` of a line named `name` (in capitals), skipping the arguments
   * before it as handles() does; false when the line is not there or not of that shape.
   */
  private seekArgument(id: number, name: Uint8Array, index: number): boolean {
    const off = this.offsetOf(id);
    if (off === NO_OFFSET || off === DEFERRED) return false;
    const b = this.bytes;
    let i = off - 1;
    for (let k = 0; k < name.length; k++, i++) if (b[i] !== name[k]) return false;
    while (isSpace(b[i])) i++;
    if (b[i] !== LPAREN) return false;
    this.pos = i + 1;
    for (let k = 0; k < index; k++) {
      this.skipSpace();
      // web-ifc leaves '*' out of the arguments, which would shift the index.
      if (b[this.pos] === STAR) return false;
      this.skip();
      this.skipSpace();
      if (b[this.pos++] !== COMMA) return false;
    }
    this.skipSpace();
    return true;
  }

  /**
   * handles(…, single) without the array: the express id of a plain reference, null for '$',
   * DEFER for anything else. The hot path of placements and bodies.
   */
  handle(id: number, name: Uint8Array, index: number): number | null | typeof DEFER {
    return this.argument(id, name, index, 'reference') as number | null | typeof DEFER;
  }

  /**
   * handle() of `count` arguments from `first` on, in one pass over the line: the same answers
   * (undefined for '$'; DEFER if any of them is not a plain reference or '$'), without seeking
   * from the start of the line for each (placements read three in a row, openings two after
   * their GlobalId and names).
   */
  handlesFrom(id: number, name: Uint8Array, first: number, count: number): (number | undefined)[] | typeof DEFER {
    const b = this.bytes;
    try {
      if (!this.seekArgument(id, name, first)) return DEFER;
      const out: (number | undefined)[] = [];
      for (let k = 0; k < count; k++) {
        const at = this.pos;
        const c = b[at];
        if (c === DOLLAR) out.push(undefined);
        else {
          if (c !== HASH) return DEFER;
          const s = ++this.pos;
          out.push(this.integer());
          if (this.pos === s) return DEFER;
        }
        if (k + 1 === count) break;
        // On to the next argument exactly as seekArgument skips one.
        this.pos = at;
        this.skip();
        this.skipSpace();
        if (b[this.pos++] !== COMMA) return DEFER;
        this.skipSpace();
      }
      return out;
    } catch (e) {
      if (e === defer) return DEFER;
      throw e;
    }
  }

  /**
   * A plain string argument as the line object's attribute holds it (str() of it), null for
   * '$'; DEFER for anything else (escapes and accents are web-ifc's to decode).
   */
  stringAt(id: number, name: Uint8Array, index: number): string | null | typeof DEFER {
    return this.argument(id, name, index, 'string') as string | null | typeof DEFER;
  }

  /** A plain number argument as num() of the line object's attribute gives it, null for '$'; DEFER for anything else. */
  realAt(id: number, name: Uint8Array, index: number): number | null | typeof DEFER {
    return this.argument(id, name, index, 'real') as number | null | typeof DEFER;
  }

  /** Argument `index` of a line named `name` read as one plain value of this kind; null for '$', DEFER for anything else. */
  private argument(id: number, name: Uint8Array, index: number, kind: 'reference' | 'string' | 'real'): number | string | null | typeof DEFER {
    try {
      if (!this.seekArgument(id, name, index)) return DEFER;
      const c = this.bytes[this.pos];
      if (c === DOLLAR) return null;
      if (kind === 'reference') {
        if (c !== HASH) return DEFER;
        const s = ++this.pos;
        const v = this.integer();
        return this.pos === s ? DEFER : v;
      }
      if (kind === 'string') {
        if (c !== QUOTE) return DEFER;
        const v = this.string();
        return this.argumentEnds() ? v : DEFER;
      }
      const v = this.real(this.pos);
      return v !== null && this.argumentEnds() ? v : DEFER;
    } catch (e) {
      if (e === defer) return DEFER;
      throw e;
    }
  }

  /** Whether the argument just read is followed by the next one or the end of the list. */
  private argumentEnds(): boolean {
    this.skipSpace();
    const c = this.bytes[this.pos];
    return c === COMMA || c === RPAREN;
  }

  /** Moves past one argument (string, list, typed value or plain token) without reading it. */
  private skip(): void {
    const b = this.bytes;
    const c = b[this.pos];
    if (c === QUOTE) {
      // Not made into a JS string: most strings skipped over are GlobalIds.
      this.stringEnd();
      return;
    }
    if (c === LPAREN) {
      this.pos++;
      this.skipSpace();
      if (b[this.pos] === RPAREN) {
        this.pos++;
        return;
      }
      for (;;) {
        this.skipSpace();
        this.skip();
        this.skipSpace();
        const d = b[this.pos++];
        if (d === RPAREN) return;
        if (d !== COMMA) throw defer;
      }
    }
    // A plain token ($, *, #12, .ENUM., a number) or a typed value's name followed by its argument.
    const s = this.pos;
    while (this.pos < b.length) {
      const d = b[this.pos];
      if (d === COMMA || d === RPAREN || d === LPAREN || d === QUOTE || d === SEMI || isSpace(d)) break;
      this.pos++;
    }
    if (this.pos === s) throw defer;
    this.skipSpace();
    if (b[this.pos] === LPAREN) this.skip();
  }

  /**
   * The numbers of a one-list line such as IFCCARTESIANPOINT((0.,5.,2.5)) or IFCDIRECTION(...),
   * without building a line object: the hot path of placements. `name` is the entity name as
   * written in capitals; any other name or shape of line answers DEFER (read the line instead).
   * The numbers equal web-ifc's (it parses each with parseFloat).
   */
  reals(id: number, name: Uint8Array): number[] | null | typeof DEFER {
    const off = this.offsetOf(id);
    if (off === NO_OFFSET) return null;
    if (off === DEFERRED) return DEFER;
    const b = this.bytes;
    let i = off - 1;
    for (let k = 0; k < name.length; k++, i++) if (b[i] !== name[k]) return DEFER;
    while (isSpace(b[i])) i++;
    if (b[i++] !== LPAREN) return DEFER;
    while (isSpace(b[i])) i++;
    if (b[i++] !== LPAREN) return DEFER;
    const out: number[] = [];
    for (;;) {
      while (isSpace(b[i])) i++;
      const v = this.real(i);
      if (v === null) return DEFER;
      out.push(v);
      i = this.pos;
      while (isSpace(b[i])) i++;
      const c = b[i++];
      if (c === RPAREN) break;
      if (c !== COMMA) return DEFER;
    }
    while (isSpace(b[i])) i++;
    if (b[i++] !== RPAREN) return DEFER;
    this.pos = i;
    try {
      this.end();
    } catch {
      return DEFER;
    }
    return out;
  }

  /**
   * A number starting at i, as parseFloat reads its text; null when it is not a plain number.
   * While the digits as an integer stay within 2^53 (exact in a double, and so was every step of
   * accumulating them) and the power of ten within 10^22 (also exact), one multiplication or
   * division gives the correctly rounded value, which is what parseFloat returns; other
   * numbers go through parseFloat itself.
   */
  private real(i: number): number | null {
    const b = this.bytes;
    const s = i;
    let negative = false;
    if (b[i] === 0x2d) {
      negative = true;
      i++;
    } else if (b[i] === 0x2b) return null;
    let mantissa = 0;
    let scale = 0;
    const intStart = i;
    while (isDigit(b[i])) mantissa = mantissa * 10 + (b[i++] - 0x30);
    if (i === intStart) return null;
    if (b[i] === DOT) {
      i++;
      while (isDigit(b[i])) {
        mantissa = mantissa * 10 + (b[i++] - 0x30);
        scale--;
      }
    }
    let exp = 0;
    if (b[i] === 0x45 || b[i] === 0x65) {
      i++;
      let eNeg = false;
      if (b[i] === 0x2d || b[i] === 0x2b) eNeg = b[i++] === 0x2d;
      const e0 = i;
      while (isDigit(b[i])) exp = exp * 10 + (b[i++] - 0x30);
      if (i === e0 || i - e0 > 4) return null;
      if (eNeg) exp = -exp;
    }
    this.pos = i;
    const e10 = scale + exp;
    let v: number;
    if (mantissa <= MAX_EXACT && e10 >= -22 && e10 <= 22) v = e10 >= 0 ? mantissa * POW10[e10] : mantissa / POW10[-e10];
    else return parseFloat(this.text.toString('latin1', s, i));
    return negative ? -v : v;
  }

  /** After an entity's argument list: blanks, then the ';' that ends the statement. */
  private end(): void {
    this.skipSpace();
    if (this.bytes[this.pos] !== SEMI) throw defer;
  }

  /**
   * Type code of the entity or type name at pos (letters, digits, '_'), as web-ifc codes that
   * spelling; blanks after it skipped. Names are looked up by a hash of their bytes, so no
   * string is made per line.
   */
  private typeCode(): number {
    const b = this.bytes;
    const s = this.pos;
    let i = this.nameEnd(s);
    if (i === s) throw defer;
    const code = this.nameEntry(this.nameHash, s, i).code;
    while (isSpace(b[i])) i++;
    this.pos = i;
    return code;
  }

  /** The entry of the name in bytes [s, e) with hash h, made (and coded by web-ifc) the first time it is met. */
  private nameEntry(h: number, s: number, e: number): NameEntry {
    const b = this.bytes;
    const known = this.names.get(h);
    if (known) {
      for (const entry of known) {
        if (entry.bytes.length !== e - s) continue;
        let k = 0;
        while (k < entry.bytes.length && entry.bytes[k] === b[s + k]) k++;
        if (k === entry.bytes.length) return entry;
      }
    }
    const entry: NameEntry = { bytes: b.slice(s, e), start: s, hash: h, code: this.codeOf(this.text.toString('latin1', s, e)), ids: null };
    if (known) known.push(entry);
    else this.names.set(h, [entry]);
    return entry;
  }

  private skipSpace(): void {
    const b = this.bytes;
    while (isSpace(b[this.pos])) this.pos++;
  }

  /** A parenthesised list; at the top level '*' arguments are left out, as web-ifc does. */
  private list(top: boolean): unknown[] {
    const b = this.bytes;
    this.pos++; // '('
    const out: unknown[] = [];
    this.skipSpace();
    if (b[this.pos] === RPAREN) {
      this.pos++;
      return out;
    }
    for (;;) {
      this.skipSpace();
      const v = this.value();
      if (v === OMITTED) {
        if (!top) throw defer;
      } else out.push(v);
      this.skipSpace();
      const c = b[this.pos];
      if (c === COMMA) this.pos++;
      else if (c === RPAREN) {
        this.pos++;
        return out;
      } else throw defer;
    }
  }

  private value(): unknown {
    const b = this.bytes;
    const c = b[this.pos];
    if (c === DOLLAR) {
      this.pos++;
      return null;
    }
    if (c === HASH) {
      this.pos++;
      const s = this.pos;
      const v = this.integer();
      if (this.pos === s) throw defer;
      return { type: REF, value: v };
    }
    if (c === QUOTE) return { type: STRING, value: this.string() };
    if (c === DOT) {
      const e = this.enumeration();
      // web-ifc turns the logical literals into booleans (and .U. into whatever it does: ask it).
      if (e.length === 1) {
        if (e === 'T') return { type: ENUM, value: true };
        if (e === 'F') return { type: ENUM, value: false };
        throw defer;
      }
      return { type: ENUM, value: e };
    }
    if (c === LPAREN) return this.list(false);
    if (isDigit(c) || c === 0x2d || c === 0x2b) return this.number();
    if (c === STAR) {
      this.pos++;
      return OMITTED;
    }
    // A typed value such as IFCLABEL('x') or IFCLENGTHMEASURE(2.5).
    const typecode = this.typeCode();
    if (b[this.pos] !== LPAREN) throw defer;
    this.pos++;
    this.skipSpace();
    const inner = this.value();
    this.skipSpace();
    if (b[this.pos] !== RPAREN || inner === null || inner === OMITTED || Array.isArray(inner)) throw defer;
    this.pos++;
    if (typecode === 0) throw defer;
    return { type: LABEL, typecode, value: (inner as { value: unknown }).value };
  }

  private integer(): number {
    const b = this.bytes;
    let v = 0;
    let i = this.pos;
    const s = i;
    while (isDigit(b[i])) v = v * 10 + (b[i++] - 0x30);
    // Beyond 2^53 the digits would not survive as a number; let web-ifc decide.
    if (i - s > 15) throw defer;
    this.pos = i;
    return v;
  }

  /** REAL when it has a '.' or an exponent (its text, as web-ifc keeps it), else INTEGER. */
  private number(): { type: number; value: number | string } {
    const b = this.bytes;
    const s = this.pos;
    let i = s;
    // A leading '+' is dropped by web-ifc's tokeniser in some places and kept in others.
    if (b[i] === 0x2b) throw defer;
    if (b[i] === 0x2d) i++;
    const digits = i;
    while (isDigit(b[i])) i++;
    if (i === digits) throw defer;
    let real = false;
    if (b[i] === DOT) {
      real = true;
      i++;
      while (isDigit(b[i])) i++;
    }
    if (b[i] === 0x45 || b[i] === 0x65) {
      real = true;
      i++;
      if (b[i] === 0x2d || b[i] === 0x2b) i++;
      const e = i;
      while (isDigit(b[i])) i++;
      if (i === e) throw defer;
    }
    this.pos = i;
    if (real) return { type: REAL, value: this.text.toString('latin1', s, i) };
    if (i - digits > 15) throw defer;
    const v = Number(this.text.toString('latin1', s, i));
    return { type: INTEGER, value: v };
  }

  /** A plain string; escapes ('\') and bytes above 127 are left to web-ifc's decoder. */
  private string(): string {
    const s = this.pos + 1;
    const doubled = this.stringEnd();
    const v = this.text.toString('latin1', s, this.pos - 1);
    return doubled ? v.replaceAll("''", "'") : v;
  }

  /** Moves pos past the string that starts at pos; whether it holds a doubled quote. Strings web-ifc must decode throw defer. */
  private stringEnd(): boolean {
    const b = this.bytes;
    let i = this.pos + 1;
    let doubled = false;
    for (;;) {
      const c = b[i];
      if (c === undefined) throw defer;
      if (c === QUOTE) {
        if (b[i + 1] === QUOTE) {
          doubled = true;
          i += 2;
          continue;
        }
        break;
      }
      if (c === BACKSLASH || c > 0x7e || c < 0x20) throw defer;
      i++;
    }
    this.pos = i + 1;
    return doubled;
  }

  private enumeration(): string {
    const b = this.bytes;
    const s = this.pos + 1;
    let i = s;
    while (i < b.length && b[i] !== DOT) {
      const c = b[i];
      if (!((c >= 0x41 && c <= 0x5a) || (c >= 0x61 && c <= 0x7a) || isDigit(c) || c === 0x5f)) throw defer;
      i++;
    }
    if (i >= b.length) throw defer;
    this.pos = i + 1;
    return this.text.toString('latin1', s, i);
  }
}
