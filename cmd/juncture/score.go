package main

import "github.com/urfave/cli/v2"

func scoreCommand() *cli.Command { return &cli.Command{Name: "score", Usage: "(coming)"} }
