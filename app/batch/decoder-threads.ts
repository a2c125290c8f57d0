// libvips threads per batch worker: set through the decoder, which loads sharp only when a stack needs it.
export { limitDecoderThreads } from '../decode';
