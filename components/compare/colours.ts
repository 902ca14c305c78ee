/** One colour per compared design (column dot, legend and curve agree). */
export const seriesColours = ["rgb(176 96 44)", "rgb(18 122 128)", "rgb(34 128 74)", "rgb(120 80 160)"];
