"""The command line on seeded random valid layouts (hardening_write_layouts): `report --json`
exits 0 and prints strict JSON (no NaN or Infinity) whose numbers are all finite and where null
stands only for a figure the report may leave out; `check` and `trace` exit 0.

usage: check_cli_random.py RENDEZVOUS WRITER N SEED
"""
import json
import math
import os
import subprocess
import sys
import tempfile

# Keys whose value is null when the figure does not apply (core/report/report_json.cpp,
# optional_number); a null anywhere else is a number the report could not give (NaN).
# delta_k_l and sinc2_now are null when a wave lies where the crystal's index formula has no real
# value (phase_matching.outside_index_data says so).
# Power, pulse and intensity figures are null when the file gives no power_mw (or no repetition
# rate or pulse length).
# A finding's beam or element is null when it concerns none; the polarization advice's plate
# figures are null when there is no plate to turn.
# Issue 14 item 7 (docs/user-guide.md, The report): a verdict line's met when it does not apply and its action
# when there is none; the phase-matching angle's figures without phase matching; the index data
# note when there is none (incidence_now_deg too outside the data); spatial_along_crystal for a
# target that is not a crystal; azimuth_deg of circular or unpolarized light; a loss's goes_to
# when it goes nowhere traced; the polarization and power fraction when the power trace did not
# reach the target.
# Issue 16 §7: the SFG spectral acceptance's held beam, null for SHG (one input, nothing held).
MAY_BE_NULL = {"confocal_ratio", "temporal", "measured_zero_mm", "emission_offset_fs",
               "walk_apart_mm", "delta_k_l", "sinc2_now", "source_mw", "power_mw", "useful_mw",
               "peak_intensity_w_cm2", "peak_fluence_j_cm2", "peak_intensity_at_waist_w_cm2",
               "beam", "element", "location", "plate", "plate_now_deg", "plate_best_deg",
               "useful_fraction_best", "useful_mw_best",
               "met", "action", "theta_pm_deg", "incidence_now_deg", "incidence_needed_deg", "rotate_by_deg",
               "rotation_axis", "walkoff_mrad", "internal_fwhm", "external_fwhm", "spectral_acceptance_fwhm_nm",
               "outside_index_data", "spatial_along_crystal", "azimuth_deg", "goes_to", "polarization",
               "power_fraction", "fwhm_fs",
               "generated", "depleted_average_mw", "material", "fluence_j_cm2", "intensity_gw_cm2", "regime",
               "reference_pulse_fs", "reference_wavelength_nm", "scaled", "source",
               "spectral_acceptance_holds", "temperature", "phase_matching_c", "acceptance_fwhm_c"}


def reject_constant(name):
    raise ValueError("non-standard JSON constant " + name)


def walk(value, path, problems):
    if isinstance(value, dict):
        for k, v in value.items():
            walk(v, path + [k], problems)
    elif isinstance(value, list):
        for i, v in enumerate(value):
            walk(v, path + [str(i)], problems)
    elif value is None:
        key = path[-1] if path else ""
        if key not in MAY_BE_NULL:
            problems.append("/".join(path) + " is null")
    elif isinstance(value, float) and not math.isfinite(value):
        problems.append("/".join(path) + " is not finite")


def run(cmd):
    p = subprocess.run(cmd, stdout=subprocess.PIPE, stderr=subprocess.PIPE, timeout=60)
    return p.returncode, p.stdout.decode("utf-8"), p.stderr.decode("utf-8")


def main():
    rv, writer, n, seed = sys.argv[1], sys.argv[2], int(sys.argv[3]), sys.argv[4]
    failures = []
    reached = 0
    with tempfile.TemporaryDirectory() as folder:
        subprocess.run([writer, folder, str(n), seed], check=True)
        files = sorted(os.listdir(folder))
        if len(files) != n:
            failures.append("expected %d layouts, found %d" % (n, len(files)))
        for name in files:
            path = os.path.join(folder, name)
            status, out, err = run([rv, "report", path, "--json"])
            if status != 0:
                failures.append("%s: report --json exited %d: %s" % (name, status, err.strip()))
                continue
            try:
                doc = json.loads(out, parse_constant=reject_constant)
            except ValueError as e:
                failures.append("%s: report --json is not strict JSON: %s" % (name, e))
                continue
            problems = []
            walk(doc, [], problems)
            failures += ["%s: %s" % (name, p) for p in problems]
            reached += "mismatch" in doc
            for command in (["check", path], ["trace", path, "--json"]):
                status, out, err = run([rv] + command)
                if status != 0:
                    failures.append("%s: %s exited %d" % (name, command[0], status))
    if reached < n // 5:
        failures.append("only %d of %d layouts have both beams at the target" % (reached, n))
    for f in failures:
        print("FAIL:", f)
    print("%d random layouts through report --json, check and trace; %d with a mismatch"
          % (n, reached))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
