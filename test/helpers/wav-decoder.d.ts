// Types for the wav-decoder npm package (1.3.0), used only as an independent decoder in tests.
declare module 'wav-decoder' {
  interface AudioData {
    sampleRate: number;
    numberOfChannels: number;
    length: number;
    channelData: Float32Array[];
  }
  const wavDecoder: {
    decode(buffer: ArrayBuffer, options?: { symmetric?: boolean }): Promise<AudioData>;
  };
  export default wavDecoder;
}
