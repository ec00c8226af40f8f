# Shared by scripts/demo and scripts/test: install what is missing, then configure and build.
# Sourced, not run. Idempotent: a second call with nothing changed only checks and returns.
set -euo pipefail
SHEETMILL_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
BUILD_DIR="${SHEETMILL_BUILD_DIR:-$SHEETMILL_ROOT/build}"

# Debian 12 packages the build, the tests and the demo need.
SHEETMILL_PACKAGES=(
  build-essential cmake pkg-config
  libgdal-dev gdal-bin libproj-dev proj-bin proj-data
  libcairo2-dev libharfbuzz-dev libfreetype-dev libfontconfig-dev libfribidi-dev
  libyaml-cpp-dev libfmt-dev libhwy-dev libqpdf-dev libcli11-dev catch2 libpng-dev liblcms2-dev
  fonts-dejavu-core fonts-noto-core poppler-utils qpdf ghostscript libgs-common python3
  python3-yaml python3-jsonschema
  slurm-wlm munge
  clang-14 libclang-rt-14-dev
)

sheetmill_install_packages() {
  local missing=()
  for p in "${SHEETMILL_PACKAGES[@]}" "$@"; do
    if ! dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed"; then
      missing+=("$p")
    fi
  done
  if [ ${#missing[@]} -gt 0 ]; then
    echo "sheetmill: installing Debian packages: ${missing[*]}" >&2
    local sudo=""
    [ "$(id -u)" -ne 0 ] && sudo="sudo"
    export DEBIAN_FRONTEND=noninteractive
    $sudo apt-get update -qq
    $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
  fi
}

sheetmill_build() {
  if [ ! -f "$BUILD_DIR/CMakeCache.txt" ]; then
    cmake -S "$SHEETMILL_ROOT" -B "$BUILD_DIR" -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
  fi
  cmake --build "$BUILD_DIR" -j "$(nproc)" "$@"
}
