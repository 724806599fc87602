package sweepfile

import "image/color"

func rgb(c [3]uint8) color.Color { return color.RGBA{R: c[0], G: c[1], B: c[2], A: 255} }
