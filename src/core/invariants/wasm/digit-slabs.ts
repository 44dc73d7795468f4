/**
 * The two digit slabs of the bracket contraction (the sources and the targets
 * of a step, taking turns) in one WebAssembly memory, where the kernels of
 * digit-kernels.ts work on them. Slab 0 starts at element 0 and slab 1 at
 * `capacity`; when a slab needs more room the memory grows and slab 1 moves up
 * to the new middle, so the slab that is not being reserved keeps its digits.
 */
import { digitKernels, type DigitKernels } from './digit-kernels.ts';
import { PAGE_BYTES, WASM32_MEMORY_MAX_BYTES } from './encoding.ts';

/** The whole of a wasm32 memory, so each slab at most 2 GiB. */
export const DIGIT_MEMORY_MAX_BYTES = WASM32_MEMORY_MAX_BYTES;
const MAX_PAGES = DIGIT_MEMORY_MAX_BYTES / PAGE_BYTES;

export type SlabIndex = 0 | 1;

export class DigitSlabs {
  private readonly memory = new WebAssembly.Memory({ initial: 1, maximum: MAX_PAGES });
  readonly kernels: DigitKernels = digitKernels(this.memory);
  /** The memory as doubles; taken again after every grow (growing detaches the old view). */
  digits = new Float64Array(this.memory.buffer);
  /** Doubles per slab. */
  private capacity = this.digits.length / 2;

  get bytes(): number {
    return this.memory.buffer.byteLength;
  }

  /** The element index where `slab` starts (it moves when the memory grows). */
  start(slab: SlabIndex): number {
    return slab * this.capacity;
  }

  /**
   * Room for `size` digits in `slab`, whose contents are not kept (the other
   * slab's are). False when two slabs of that size do not fit into a wasm32
   * memory, or the machine refuses to grow it.
   */
  reserve(slab: SlabIndex, size: number): boolean {
    if (size <= this.capacity) return true;
    const wanted = Math.ceil((2 * Math.ceil(size * 1.25) * 8) / PAGE_BYTES);
    const pages = Math.min(wanted, MAX_PAGES);
    if ((pages * PAGE_BYTES) / 16 < size) return false;
    const oldCapacity = this.capacity;
    try {
      this.memory.grow(pages - this.bytes / PAGE_BYTES);
    } catch (error) {
      if (error instanceof RangeError) return false;
      throw error;
    }
    this.digits = new Float64Array(this.memory.buffer);
    this.capacity = this.digits.length / 2;
    if (slab === 0) this.digits.copyWithin(this.capacity, oldCapacity, 2 * oldCapacity);
    return true;
  }
}

/** Memories kept from one diagram to the next stay below this (a wasm memory never shrinks). */
const KEEP_BYTES = 64 * 1024 * 1024;
let shared: DigitSlabs | undefined;

/**
 * The slabs for one contraction. One memory serves diagram after diagram
 * (contractions run one at a time in a thread), so small diagrams do not each
 * reserve a fresh memory's address space.
 */
export function borrowDigitSlabs(): DigitSlabs {
  shared ??= new DigitSlabs();
  return shared;
}

/** Called after each contraction: a memory grown past KEEP_BYTES is let go, so the garbage collector can free it. */
export function returnDigitSlabs(): void {
  if (shared && shared.bytes > KEEP_BYTES) shared = undefined;
}
