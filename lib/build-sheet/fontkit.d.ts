// fontkit ships no types; the build sheet's font module needs only `create`.
declare module "fontkit" {
  export function create(buffer: Uint8Array, postscriptName?: string): unknown;
}
