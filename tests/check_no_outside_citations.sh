#!/bin/bash
# Keeps the repository self-contained in what it cites (issue 18, item 5).
#
# Fails when a tracked file outside docs/:
#   1. cites the outside "shared" folder (the word followed by a slash), or
#   2. names one of the outside documents (physics, practice, design, style, toolchain, each
#      with the .md suffix) without the "docs/" prefix;
# and when any tracked file (docs/ included)
#   3. names a document under docs/ (a .md file) that does not exist, or
#   4. cites "docs/<name>.md §N" (also "§N and §M", "§N, §M") where that document has no heading
#      numbered N ("## 2. …", "### 2.1 …").
# The patterns below are spelt so that this file does not match them itself.
#
# Usage: check_no_outside_citations.sh [REPOSITORY_ROOT]   (default: the current directory)
set -u
export LC_ALL=C
root=${1:-.}
cd "$root" || { echo "no such directory: $root" >&2; exit 2; }

if git rev-parse --is-inside-work-tree >/dev/null 2>&1; then
    list_files() { git ls-files -z; }
else
    list_files() { find . -path ./.git -prune -o -path ./build -prune -o -type f -print0 | sed -z 's|^\./||'; }
fi

names='(physics|practice|design|style|toolchain)'
outside_folder='(^|[^A-Za-z0-9_-])shared[/]'
bare_doc="(?<!docs/)(?<![A-Za-z0-9_-])${names}[.]md"
section='[0-9]+(?:[.][0-9]+)*'
cite="docs/[A-Za-z0-9_-]+[.]md(?:\\s*§${section}(?:\\s*(?:,|and|or|&)\\s*§${section})*)?"

failures=0
report() { echo "$1"; failures=$((failures + 1)); }

# 1 and 2: outside docs/.
while IFS= read -r hit; do
    report "outside citation: $hit"
done < <(list_files | grep -z -v '^docs/' | xargs -0 -r grep -s -I -n -H -P -e "${outside_folder}|${bare_doc}" --)

# 3 and 4: every citation of a document under docs/, everywhere.
declare -A sections_of
sections() {  # the heading numbers of one document, one per line
    sed -n -E 's/^#+[[:space:]]+([0-9]+(\.[0-9]+)*)\.?[[:space:]].*/\1/p' "$1"
}
while IFS= read -r hit; do
    where=${hit%%:docs/*}             # FILE:LINE
    text=docs/${hit#*:docs/}          # the citation itself
    doc=$(printf '%s\n' "$text" | grep -o -E '^docs/[A-Za-z0-9_-]+\.md')
    if [ ! -f "$doc" ]; then
        report "$where: cites $doc, which does not exist"
        continue
    fi
    if [ -z "${sections_of[$doc]+x}" ]; then
        sections_of[$doc]=" $(sections "$doc" | tr '\n' ' ') "
    fi
    for n in $(printf '%s\n' "${text#"$doc"}" | grep -o -P "§\\K${section}"); do
        case "${sections_of[$doc]}" in
            *" $n "*) ;;
            *) report "$where: cites $doc §$n, which has no section $n" ;;
        esac
    done
done < <(list_files | xargs -0 -r grep -s -I -n -H -o -P -e "$cite" --)

if [ "$failures" -gt 0 ]; then
    echo "$failures citation problem(s): cite docs/physics.md or docs/practice.md by an existing section number"
    exit 1
fi
echo "no outside citations; every docs/ section cited exists"
