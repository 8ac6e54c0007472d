#!/usr/bin/env bash
# Regenerates app/fonts/inter-*.woff2 from the npm package's latin files (@fontsource/inter), cut to
# the characters the app shows: ASCII, Latin-1 (accented pilot names), dashes, quotes, bullets and
# ellipsis, arrows and the minus sign; keeping kerning, ligatures and tabular figures (tnum). Needs
# Debian's python3-fonttools and python3-brotli (installed when missing). The 600 weight is not
# shipped: font-semibold uses the 700 file (app/layout.tsx).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
/usr/bin/python3 -c "import fontTools, brotli" 2>/dev/null || apt_install python3-fonttools python3-brotli
UNICODES="U+0020-007E,U+00A0-00FF,U+2010-2027,U+2030-203A,U+2190-2193,U+2212"
for w in 400 700 800; do
  /usr/bin/python3 -m fontTools.subset "node_modules/@fontsource/inter/files/inter-latin-$w-normal.woff2" \
    --unicodes="$UNICODES" --layout-features='kern,liga,calt,tnum,case' --flavor=woff2 \
    --output-file="app/fonts/inter-subset-$w-normal.woff2"
done
say "fonts written: $(ls -1 app/fonts/inter-subset-*.woff2 | tr '\n' ' ')"
