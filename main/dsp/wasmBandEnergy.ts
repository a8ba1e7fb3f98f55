// The detection filter (core/detect bandEnergy: three biquad sections, squares summed per hop) as a WebAssembly SIMD
// kernel written here byte by byte: each f64x2 lane is one channel, and the operations are core's, in its order, in
// double precision without fused multiply-add, so hop energies are bit-identical to the TypeScript loop. Samples, hops.
import { useBandEnergyKernels, type BandEnergyGroup, type BandEnergyKernels } from '../../core/detect';

/** Channel pairs (f64x2 vectors) filtered in one loop: two independent recursions hide each other's latency. */
const VECTORS = 2;
export const WASM_GROUP_CHANNELS = 2 * VECTORS;
/** Frames per kernel call: the group's samples are copied into the module's memory in chunks of this many. */
const CHUNK_FRAMES = 8192;

// Memory layout (bytes): coefficients as 15 splatted vectors, +infinity splatted, per vector its six filter states and
// running sum, the frames of the hop in progress, then the input chunk (float32, channel after channel) and the hops out.
const COEFFICIENTS_AT = 0;
const INFINITY_AT = 240;
const STATES_AT = 256;
const STATE_BYTES = 7 * 16;
const IN_HOP_AT = STATES_AT + VECTORS * STATE_BYTES;
const INPUT_AT = 1024;
const OUTPUT_AT = INPUT_AT + WASM_GROUP_CHANNELS * CHUNK_FRAMES * 4;
/** Room for a hop of one frame (every frame completes a hop) plus one. */
const MEMORY_PAGES = Math.ceil((OUTPUT_AT + (CHUNK_FRAMES + 1) * WASM_GROUP_CHANNELS * 8) / 65536);

function uleb(value: number): number[] {
  const bytes: number[] = [];
  let rest = value;
  do {
    let byte = rest & 0x7f;
    rest >>>= 7;
    if (rest !== 0) byte |= 0x80;
    bytes.push(byte);
  } while (rest !== 0);
  return bytes;
}

const simd = (opcode: number) => [0xfd, ...uleb(opcode)];
const op = {
  get: (local: number) => [0x20, ...uleb(local)],
  set: (local: number) => [0x21, ...uleb(local)],
  tee: (local: number) => [0x22, ...uleb(local)],
  i32: (value: number) => [0x41, ...uleb(value)],
  i32Add: [0x6a], i32Eq: [0x46], i32GeU: [0x4f], i32Shl: [0x74],
  i32Load: (offset: number) => [0x28, 2, ...uleb(offset)],
  i32Store: (offset: number) => [0x36, 2, ...uleb(offset)],
  f32Load: (offset: number) => [0x2a, 2, ...uleb(offset)], f64PromoteF32: [0xbb],
  block: [0x02, 0x40], loop: [0x03, 0x40], if: [0x04, 0x40], end: [0x0b], br: (depth: number) => [0x0c, depth], brIf: (depth: number) => [0x0d, depth],
  v128Load: (offset: number) => [...simd(0), 4, ...uleb(offset)],
  v128Store: (offset: number) => [...simd(11), 4, ...uleb(offset)],
  f64x2Splat: simd(20), f64x2ReplaceLane1: [...simd(34), 1], f64x2Lt: simd(73), v128And: simd(78),
  f64x2Add: simd(240), f64x2Sub: simd(241), f64x2Mul: simd(242),
};

/**
 * The module: `run(frames, hopFrames) -> completed hops` over the chunk at INPUT_AT, states carried in memory. Per
 * sample and section (core/detect/bandEnergy.ts): y = b0·x + z1; z1 = (b1·x + z2) - a1·y; z2 = b2·x - a2·y; then
 * sum += y2·y2; at a hop's end a lane whose sum is not below +infinity is reset (sum and states to +0), as in core.
 */
export function bandEnergyModuleBytes(): Uint8Array<ArrayBuffer> {
  // Locals: params 0 frames, 1 hopFrames; i32 2 i, 3 inHop, 4 hops, 5 offset; v128 from 6: per vector x, y0..y2,
  // z10 z20 z11 z21 z12 z22, sum (11 each), then the 15 coefficients and +infinity.
  const [frames, hopFrames, i, inHop, hops, offset] = [0, 1, 2, 3, 4, 5];
  const vector = (v: number) => {
    const base = 6 + 11 * v;
    return { x: base, y: [base + 1, base + 2, base + 3], z: [0, 1, 2, 3, 4, 5].map((k) => base + 4 + k), sum: base + 10 };
  };
  const coefficient = (k: number) => 6 + 11 * VECTORS + k;
  const infinity = coefficient(15);
  const body: number[] = [];
  const emit = (...parts: number[][]) => { for (const part of parts) body.push(...part); };
  for (let k = 0; k < 15; k++) emit(op.i32(0), op.v128Load(COEFFICIENTS_AT + 16 * k), op.set(coefficient(k)));
  emit(op.i32(0), op.v128Load(INFINITY_AT), op.set(infinity));
  for (let v = 0; v < VECTORS; v++) {
    const { z, sum } = vector(v);
    for (let k = 0; k < 6; k++) emit(op.i32(0), op.v128Load(STATES_AT + v * STATE_BYTES + 16 * k), op.set(z[k]!));
    emit(op.i32(0), op.v128Load(STATES_AT + v * STATE_BYTES + 96), op.set(sum));
  }
  emit(op.i32(0), op.i32Load(IN_HOP_AT), op.set(inHop), op.i32(0), op.set(i), op.i32(0), op.set(hops));
  emit(op.block, op.loop, op.get(i), op.get(frames), op.i32GeU, op.brIf(1));
  emit(op.get(i), op.i32(2), op.i32Shl, op.set(offset));
  for (let v = 0; v < VECTORS; v++) {
    // x = [channel 2v, channel 2v + 1] at frame i, promoted to double.
    const { x } = vector(v);
    emit(op.get(offset), op.f32Load(INPUT_AT + 2 * v * CHUNK_FRAMES * 4), op.f64PromoteF32, op.f64x2Splat);
    emit(op.get(offset), op.f32Load(INPUT_AT + (2 * v + 1) * CHUNK_FRAMES * 4), op.f64PromoteF32, op.f64x2ReplaceLane1, op.set(x));
  }
  for (let section = 0; section < 3; section++) {
    const [b0, b1, b2, a1, a2] = [0, 1, 2, 3, 4].map((j) => coefficient(5 * section + j)) as [number, number, number, number, number];
    for (let v = 0; v < VECTORS; v++) {
      const { x, y, z } = vector(v);
      const input = section === 0 ? x : y[section - 1]!;
      const [out, z1, z2] = [y[section]!, z[2 * section]!, z[2 * section + 1]!];
      emit(op.get(b0), op.get(input), op.f64x2Mul, op.get(z1), op.f64x2Add, op.set(out));
      emit(op.get(b1), op.get(input), op.f64x2Mul, op.get(z2), op.f64x2Add, op.get(a1), op.get(out), op.f64x2Mul, op.f64x2Sub, op.set(z1));
      emit(op.get(b2), op.get(input), op.f64x2Mul, op.get(a2), op.get(out), op.f64x2Mul, op.f64x2Sub, op.set(z2));
    }
  }
  for (let v = 0; v < VECTORS; v++) {
    const { y, sum } = vector(v);
    emit(op.get(sum), op.get(y[2]!), op.get(y[2]!), op.f64x2Mul, op.f64x2Add, op.set(sum));
  }
  emit(op.get(inHop), op.i32(1), op.i32Add, op.tee(inHop), op.get(hopFrames), op.i32Eq, op.if);
  for (let v = 0; v < VECTORS; v++) {
    const { x, z, sum } = vector(v);
    // x becomes the mask of finite sums (all ones where sum < +infinity): the other lane's sum and states are zeroed.
    emit(op.get(sum), op.get(infinity), op.f64x2Lt, op.set(x), op.get(sum), op.get(x), op.v128And, op.set(sum));
    for (let k = 0; k < 6; k++) emit(op.get(z[k]!), op.get(x), op.v128And, op.set(z[k]!));
    emit(op.get(hops), op.i32(4 + Math.log2(VECTORS)), op.i32Shl, op.get(sum), op.v128Store(OUTPUT_AT + 16 * v));
    // sum - sum: +0 in both lanes (both are finite now).
    emit(op.get(sum), op.get(sum), op.f64x2Sub, op.set(sum));
  }
  emit(op.get(hops), op.i32(1), op.i32Add, op.set(hops), op.i32(0), op.set(inHop), op.end);
  emit(op.get(i), op.i32(1), op.i32Add, op.set(i), op.br(0), op.end, op.end);
  for (let v = 0; v < VECTORS; v++) {
    const { z, sum } = vector(v);
    for (let k = 0; k < 6; k++) emit(op.i32(0), op.get(z[k]!), op.v128Store(STATES_AT + v * STATE_BYTES + 16 * k));
    emit(op.i32(0), op.get(sum), op.v128Store(STATES_AT + v * STATE_BYTES + 96));
  }
  emit(op.i32(0), op.get(inHop), op.i32Store(IN_HOP_AT), op.get(hops), op.end);

  const locals = [[4, 0x7f], [11 * VECTORS + 16, 0x7b]] as const;
  const code = [...uleb(locals.length), ...locals.flatMap(([count, type]) => [...uleb(count), type]), ...body];
  const section = (id: number, bytes: number[]) => [id, ...uleb(bytes.length), ...bytes];
  const name = (text: string) => [...uleb(text.length), ...Array.from(text, (c) => c.charCodeAt(0))];
  return new Uint8Array([
    0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00,
    ...section(1, [1, 0x60, 2, 0x7f, 0x7f, 1, 0x7f]), // type: (i32, i32) -> i32
    ...section(3, [1, 0]), // function 0 has type 0
    ...section(5, [1, 0x00, ...uleb(MEMORY_PAGES)]), // one memory, MEMORY_PAGES pages
    ...section(7, [2, ...name('run'), 0x00, 0, ...name('memory'), 0x02, 0]),
    ...section(10, [1, ...uleb(code.length), ...code]),
  ]);
}

/** The part of the WebAssembly JavaScript API used here (main's type libraries do not declare it). */
declare const WebAssembly: {
  validate(bytes: Uint8Array): boolean;
  Module: new (bytes: Uint8Array) => KernelModule;
  Instance: new (module: KernelModule, imports: object) => { exports: unknown };
};
type KernelModule = { readonly kernelModule?: never };
interface KernelExports { run(frames: number, hopFrames: number): number; memory: { buffer: ArrayBuffer } }

function groupKernel(module: KernelModule, coefficients: Float64Array, hopFrames: number): BandEnergyGroup {
  const exports = new WebAssembly.Instance(module, {}).exports as unknown as KernelExports;
  const doubles = new Float64Array(exports.memory.buffer);
  const floats = new Float32Array(exports.memory.buffer);
  for (let k = 0; k < 15; k++) doubles.fill(coefficients[k]!, (COEFFICIENTS_AT >> 3) + 2 * k, (COEFFICIENTS_AT >> 3) + 2 * k + 2);
  doubles.fill(Number.POSITIVE_INFINITY, INFINITY_AT >> 3, (INFINITY_AT >> 3) + 2);
  return {
    run(inputs, firstChannel, fromFrame, toFrame, hopEnergies) {
      let completed = 0;
      for (let from = fromFrame; from < toFrame; from += CHUNK_FRAMES) {
        const to = Math.min(toFrame, from + CHUNK_FRAMES);
        for (let k = 0; k < WASM_GROUP_CHANNELS; k++) floats.set(inputs[firstChannel + k]!.subarray(from, to), (INPUT_AT >> 2) + k * CHUNK_FRAMES);
        const hops = exports.run(to - from, hopFrames);
        for (let k = 0; k < WASM_GROUP_CHANNELS; k++) {
          const out = hopEnergies[firstChannel + k]!;
          for (let j = 0, at = (OUTPUT_AT >> 3) + k; j < hops; j++, at += WASM_GROUP_CHANNELS) out[completed + j] = doubles[at]!;
        }
        completed += hops;
      }
      return completed;
    },
  };
}

/**
 * The kernels for core/detect, or undefined when this runtime has no WebAssembly SIMD. `hopFrames` must be a whole
 * number from 1 (the kernel counts frames in 32 bits).
 */
export function wasmBandEnergyKernels(): BandEnergyKernels | undefined {
  const bytes = bandEnergyModuleBytes();
  if (typeof WebAssembly !== 'object' || !WebAssembly.validate(bytes)) return undefined;
  const module = new WebAssembly.Module(bytes);
  return {
    groupChannels: WASM_GROUP_CHANNELS,
    createGroup: (coefficients, hopFrames) => (Number.isInteger(hopFrames) && hopFrames >= 1 && hopFrames < 2 ** 31 ? groupKernel(module, coefficients, hopFrames) : undefined),
  };
}

/** Makes this thread's detection filter use the WebAssembly kernels where they validate; returns whether it does. */
export function useWasmBandEnergy(): boolean {
  let kernels: BandEnergyKernels | undefined;
  try {
    kernels = wasmBandEnergyKernels();
  } catch {
    kernels = undefined;
  }
  useBandEnergyKernels(kernels);
  return kernels !== undefined;
}
