"""Checks `rendezvous report LAYOUT --json` against the report contract
(docs/schemas/report.schema.json; docs/user-guide.md, "The report"): one JSON object, parsed by Python's json
module, holding every contract key that applies to the layout (mismatch and overlap with two
beams, stage with a stage, phase matching with a crystal target). The power and peak-intensity
keys come with the polarization-and-power issue and are not checked yet.
Usage: check_report_contract.py BINARY LAYOUT"""
import json
import subprocess
import sys

binary, layout_path = sys.argv[1], sys.argv[2]
run = subprocess.run([binary, "report", layout_path, "--json"], capture_output=True, text=True)
if run.returncode != 0:
    sys.exit(f"exit status {run.returncode}: {run.stderr}")
report = json.loads(run.stdout)
layout = json.load(open(layout_path))
missing = []


def need(node, dotted):
    for part in dotted.split("."):
        if not isinstance(node, dict) or part not in node:
            missing.append(dotted)
            return None
        node = node[part]
    return node


plane_keys = ["radius_um", "waist_um", "waist_offset_mm", "rayleigh_mm"]
for beam in layout["beams"]:
    b = need(report, "beams." + beam["id"])
    if b is None:
        continue
    for key in ["wavelength_nm", "path_mm", "arrival_fs", "target.hit_mm", "elements"]:
        need(b, key)
    # Power and intensity: present (a number, or null when the file gives no power_mw), and a
    # number when it gives one.
    for key in ["target.power_mw", "target.peak_intensity_w_cm2"]:
        value = need(b, key)
        if beam.get("power_mw") and key == "target.power_mw" and not isinstance(value, (int, float)):
            missing.append(beam["id"] + "." + key + " (a number)")
    for key in plane_keys:
        for plane in ["tangential", "sagittal"]:
            need(b, f"target.{key}.{plane}")
    for element in b.get("elements", []):
        for key in ["id", "s_mm", "radius_um.tangential", "radius_um.sagittal", "clipping"]:
            need(element, key)
if len(layout["beams"]) == 2:
    for key in ["waist_offset_mm", "waist_ratio", "lateral_um", "angle_mrad", "delay_fs"]:
        need(report, "mismatch." + key)
    for key in ["spatial", "temporal", "combined"]:
        need(report, "overlap." + key)
if any(e["type"] == "stage" for e in layout["elements"]) and len(layout["beams"]) == 2:
    for key in ["id", "position_mm", "zero_delay_mm"]:
        need(report, "stage." + key)
target = next(e for e in layout["elements"] if e["id"] == layout["target"])
if target["type"] == "crystal":
    for key in ["process", "output_nm", "theta_pm_deg", "theta_now_deg", "rotate_by_deg", "walkoff_mrad"]:
        need(report, "phase_matching." + key)
    # Every pair's GVM with its waves as data, and the wave the spectral acceptance tunes.
    pm = report.get("phase_matching") or {}
    if pm.get("phase_matchable"):
        for g in need(report, "phase_matching.gvm") or []:
            for key in ["between", "waves", "polarities", "fs_per_mm", "walk_apart_mm"]:
                need(g, key)
        need(report, "phase_matching.spectral_acceptance_tunes")
        need(report, "phase_matching.spectral_acceptance_holds")
# Generated light, B-integral and damage thresholds: always present (null or empty when they do
# not apply); when given, every figure a finite number (JSON has no NaN; Python's parser would
# take one).
generated = need(report, "generated")
if generated is not None:
    for key in ["output_nm", "d_eff_pm_v", "input_mw", "pulse_fwhm_fs", "xi", "walkoff_parameter", "h_now",
                "h_best", "pulse_factor_now", "pulse_factor_best", "now.average_mw", "now.energy_nj",
                "now.efficiency", "best.average_mw", "best.energy_nj", "best.efficiency", "assumptions"]:
        need(generated, key)
for entry in need(report, "b_integral") or []:
    for key in ["beam", "element", "material", "in_crystal", "length_mm", "peak_intensity_w_cm2", "b_rad"]:
        need(entry, key)
for entry in need(report, "damage_thresholds") or []:
    for key in ["beam", "element", "typical"]:
        need(entry, key)


def non_finite(node, where):
    if isinstance(node, float) and (node != node or node in (float("inf"), float("-inf"))):
        missing.append(where + " (finite)")
    elif isinstance(node, dict):
        for k, v in node.items():
            non_finite(v, where + "." + k)
    elif isinstance(node, list):
        for k, v in enumerate(node):
            non_finite(v, f"{where}[{k}]")


non_finite(report, "report")
warnings = need(report, "warnings")
for w in warnings or []:
    for key in ["code", "severity", "beam", "element", "message"]:
        need(w, key)
if missing:
    sys.exit("missing contract keys: " + ", ".join(missing))
print(f"{layout_path}: every contract key present")
