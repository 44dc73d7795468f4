/**
 * The memory of the modular bracket engine, in 32-bit words: first the
 * program of the current step (read by accumulateStep, residue-kernels.ts),
 * then two residue slabs (the sources and the targets of a step, taking
 * turns). Slab 0 starts right after the program and slab 1 `capacity` words
 * later; growing moves slab 1 up, so the slab not being reserved keeps its
 * residues.
 */
import type { SlabIndex } from './digit-slabs.ts';
import { PAGE_BYTES, WASM32_MEMORY_MAX_BYTES } from './encoding.ts';
import { residueKernels, type ResidueKernels } from './residue-kernels.ts';

/** The whole of a wasm32 memory: the program and both slabs. */
export const RESIDUE_MEMORY_MAX_BYTES = WASM32_MEMORY_MAX_BYTES;
const MAX_PAGES = RESIDUE_MEMORY_MAX_BYTES / PAGE_BYTES;

export class ResidueSlabs {
  private readonly memory = new WebAssembly.Memory({ initial: 1, maximum: MAX_PAGES });
  readonly kernels: ResidueKernels = residueKernels(this.memory);
  /** The memory as words; taken again after every grow (growing detaches the old view). */
  words = new Int32Array(this.memory.buffer);
  private capacity: number;

  /** `programWords`: room for the longest step program. */
  constructor(private readonly programWords: number) {
    if (!this.reserveWords(programWords + 2)) throw new RangeError(`no memory for a step program of ${programWords} words`);
    this.capacity = (this.words.length - programWords) >> 1;
  }

  get bytes(): number {
    return this.memory.buffer.byteLength;
  }

  start(slab: SlabIndex): number {
    return this.programWords + slab * this.capacity;
  }

  /** Room for `size` words in `slab` (its contents are not kept, the other slab's are); false when it cannot be had. */
  reserve(slab: SlabIndex, size: number): boolean {
    if (size <= this.capacity) return true;
    const oldCapacity = this.capacity;
    if (!this.reserveWords(this.programWords + 2 * Math.ceil(size * 1.25))) return false;
    this.capacity = (this.words.length - this.programWords) >> 1;
    if (this.capacity < size) return false;
    if (slab === 0) this.words.copyWithin(this.programWords + this.capacity, this.programWords + oldCapacity, this.programWords + 2 * oldCapacity);
    return true;
  }

  /** Grows the memory to at least `words` words (up to its maximum); false if the machine or wasm32 refuses. */
  private reserveWords(words: number): boolean {
    const pages = Math.min(Math.ceil((words * 4) / PAGE_BYTES), MAX_PAGES);
    if (pages * PAGE_BYTES <= this.bytes) return this.words.length >= words;
    try {
      this.memory.grow(pages - this.bytes / PAGE_BYTES);
    } catch (error) {
      if (error instanceof RangeError) return false;
      throw error;
    }
    this.words = new Int32Array(this.memory.buffer);
    return this.words.length >= words;
  }
}
