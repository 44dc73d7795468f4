/**
 * The two residue slabs of the modular bracket engine (the sources and the
 * targets of a step, taking turns) in one WebAssembly memory of 32-bit words,
 * where the kernels of residue-kernels.ts work on them. Slab 0 starts at word 0
 * and slab 1 at `capacity`; growing moves slab 1 up to the new middle, so the
 * slab not being reserved keeps its residues.
 */
import { residueKernels, type ResidueKernels } from './residue-kernels.ts';

const PAGE_BYTES = 65536;
/** A wasm32 memory has at most 2^16 pages of 64 KiB. */
export const RESIDUE_MEMORY_MAX_BYTES = 2 ** 32;
const MAX_PAGES = RESIDUE_MEMORY_MAX_BYTES / PAGE_BYTES;

export type SlabIndex = 0 | 1;

export class ResidueSlabs {
  private readonly memory = new WebAssembly.Memory({ initial: 1, maximum: MAX_PAGES });
  readonly kernels: ResidueKernels = residueKernels(this.memory);
  /** The memory as words; taken again after every grow (growing detaches the old view). */
  words = new Int32Array(this.memory.buffer);
  private capacity = this.words.length / 2;

  get bytes(): number {
    return this.memory.buffer.byteLength;
  }

  start(slab: SlabIndex): number {
    return slab * this.capacity;
  }

  /** Room for `size` words in `slab` (its contents are not kept, the other slab's are); false when it cannot be had. */
  reserve(slab: SlabIndex, size: number): boolean {
    if (size <= this.capacity) return true;
    const pages = Math.min(Math.ceil((2 * Math.ceil(size * 1.25) * 4) / PAGE_BYTES), MAX_PAGES);
    if ((pages * PAGE_BYTES) / 8 < size) return false;
    const oldCapacity = this.capacity;
    try {
      this.memory.grow(pages - this.bytes / PAGE_BYTES);
    } catch (error) {
      if (error instanceof RangeError) return false;
      throw error;
    }
    this.words = new Int32Array(this.memory.buffer);
    this.capacity = this.words.length / 2;
    if (slab === 0) this.words.copyWithin(this.capacity, oldCapacity, 2 * oldCapacity);
    return true;
  }
}
