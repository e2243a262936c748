#!/usr/bin/env bash
# Extra Debian packages for the export tests, sourced by scripts/test.sh after common.sh:
# pdflatex with the standard packages the exported .tex uses (amsmath, amssymb, hyperref, fancyhdr,
# lmodern/T1 fonts). Installed only when pdflatex is missing.
ensure_debian_package pdflatex texlive-latex-base texlive-latex-recommended texlive-fonts-recommended
# nauty's generators (geng, gentreeg, vcolg, multig) as an independent reference for the enumeration tests.
ensure_debian_package nauty-geng nauty
