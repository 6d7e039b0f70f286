#!/bin/sh
# Rewrites every reference file nc/X.nc from cdl/X.cdl with the netCDF C library's ncgen
# (Debian package netcdf-bin). The .nc files are committed, so the tests do not need ncgen.
set -eu
cd "$(dirname "$0")"
mkdir -p nc
for cdl in cdl/*.cdl; do
  name=$(basename "$cdl" .cdl)
  ncgen -k classic -o "nc/$name.nc" "$cdl"
done
