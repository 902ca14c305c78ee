// react-pdf sets an SVG label's typeface from its style (the renderer reads fontFamily, fontSize and
// fontWeight there), but its types list only paint attributes; this adds the three it reads.
import "@react-pdf/types/svg";

declare module "@react-pdf/types/svg" {
  interface SVGPresentationAttributes {
    fontFamily?: string | string[];
    fontSize?: number | string;
    fontWeight?: number | string;
  }
}
