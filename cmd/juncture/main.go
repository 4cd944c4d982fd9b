package main

import (
	_ "github.com/schollz/progressbar/v3"
	_ "github.com/urfave/cli/v2"
	_ "gonum.org/v1/gonum/stat/distuv"
	_ "gonum.org/v1/plot"
	_ "golang.org/x/text/unicode/norm"
)

func main() {}
