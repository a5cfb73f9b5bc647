#!/usr/bin/env bash
# Starts over: removes the local cluster under .data/ (the next `npm start` seeds it anew).
source "$(dirname "$0")/lib.sh"
pg_destroy dev
log "local database removed; run npm start to create and seed it again"
