"""The command line, the built-in demo study and study specifications, run as
a user would (subprocesses), with their files checked."""

import pathlib
import subprocess
import sys

import pytest

pytest.importorskip("matplotlib")
pytest.importorskip("xarray")

PNG = b"\x89PNG\r\n\x1a\n"


def run(*args, cwd=None):
    return subprocess.run([sys.executable, "-m", "wetboil", *args], capture_output=True, text=True, timeout=600,
                          cwd=cwd)


def test_version():
    import wetboil

    r = run("--version")
    assert r.returncode == 0 and r.stdout.strip() == f"wetboil {wetboil.__version__}"


def test_help_on_every_command():
    r = run("--help")
    assert r.returncode == 0 and "demo" in r.stdout and "run" in r.stdout and "CAUTION" in r.stdout
    for cmd in ("demo", "run"):
        r = run(cmd, "--help")
        assert r.returncode == 0 and "--out" in r.stdout


def _check_outputs(out: pathlib.Path, names, stdout: str):
    import xarray as xr

    for f in ("boiling_curves.png", "chf_receding_orientation.png", "onset_superheat_map.png"):
        data = (out / f).read_bytes()
        assert data[:8] == PNG and len(data) > 10_000, f
    report = (out / "report.md").read_text()
    for name in names:
        assert name in report and name in stdout
    assert "CAUTION" in report and "CAUTION" in stdout
    assert "doi:10.1115/1.1409265" in report  # Kandlikar (2001), the design CHF method
    assert "Validity flags" in report
    ds = xr.load_dataset(out / "sweep.nc")
    assert set(ds["surface"].values) == set(names)
    summary = (out / "summary.csv").read_text().splitlines()
    assert summary[0].startswith("surface,") and len(summary) == 1 + ds["chf"].size
    assert not any(p.name.startswith(".partial") for p in out.iterdir())


def test_demo_end_to_end(tmp_path):
    from wetboil.demo import study_path
    from wetboil.report import load_spec

    out = tmp_path / "demo"
    r = run("demo", "--out", str(out))
    assert r.returncode == 0, r.stderr
    study = load_spec(study_path())
    _check_outputs(out, [s.name for s in study.surfaces], r.stdout)
    assert "Report:" in r.stdout and str((out / "report.md").resolve()) in r.stdout
    assert "invented" in study.title and "invented" in study.meta["lab"]


def test_report_figures_skip_a_state_without_saturation(tmp_path):
    """Behavioural contract: a Study built in code (load_spec refuses such states) whose first
    pressure is above the critical point (22.064 MPa, IAPWS R6-95(2018)) still gets its report;
    the figures use the first pressure that has a saturated state."""
    import warnings

    from wetboil.demo import study_path
    from wetboil.report import load_spec, run_study

    study = load_spec(study_path())
    study.states, study.surfaces = [3.0e7, 101325.0], study.surfaces[:2]
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        report = run_study(study, tmp_path)
    assert report.exists() and (tmp_path / "boiling_curves.png").exists()


def test_demo_default_folder_is_new(tmp_path):
    r = run("demo", cwd=tmp_path)
    assert r.returncode == 0, r.stderr
    made = [p for p in tmp_path.iterdir() if p.name.startswith("wetboil-demo-")]
    assert len(made) == 1 and (made[0] / "report.md").exists()


SPEC = """
[study]
title = "Two-coating check (invented)"
fluid = "water"
pressures_Pa = [101325.0, 300000.0]
heat_fluxes_W_m2 = [250000.0]
orientations_deg = [0.0, 90.0]
surfaces_file = "surfaces.csv"
chunks = 4

[methods]
chf = ["kandlikar", "zuber"]
onset = "kandlikar"

[[surface]]
name = "inline (invented)"
static_deg = 60.0
advancing_deg = 70.0
receding_deg = 40.0
"""


def test_run_a_spec_with_a_surfaces_file_and_chunks(tmp_path):
    (tmp_path / "surfaces.csv").write_text("name,static_deg,advancing_deg,receding_deg,C_sf\n"
                                           "from csv (invented),30,40,20,0.013\n")
    spec = tmp_path / "study.toml"
    spec.write_text(SPEC)
    out = tmp_path / "out"
    r = run("run", str(spec), "--out", str(out))
    assert r.returncode == 0, r.stderr
    _check_outputs(out, ["from csv (invented)", "inline (invented)"], r.stdout)


@pytest.mark.parametrize("change, message", [
    (("chunks = 4", "chunkz = 4"), r"study.toml:9: unknown key 'chunkz' in \[study\]"),
    (('fluid = "water"', 'fluid = "Unobtainium"'), r"study.toml:4: \[study\] unknown fluid 'Unobtainium'"),
    (("orientations_deg = [0.0, 90.0]", "orientations_deg = []"), r"study.toml:7: \[study\] orientations_deg is empty"),
    (("orientations_deg = [0.0, 90.0]", "orientations_deg = [0.0, 200.0]"),
     r"study.toml:7: \[study\] orientations_deg must lie in 0-180"),
    (("orientations_deg = [0.0, 90.0]", "orientations_deg = [0.0, 90.0]\nsubcoolings_K = [0.0, -5.0]"),
     r"study.toml:8: \[study\] subcoolings_K must be zero or positive"),
    (("advancing_deg = 70.0", "advancing_deg = 30.0"), r"advancing angle 30 deg is below the receding angle 40"),
    (('onset = "kandlikar"', 'onset = "guess"'), r"study.toml:\d+: \[methods\] onset: unknown method 'guess'"),
    # a sub-table of [study] is pointed at by its header's line (wiring; the TOML is this test's own)
    (("[methods]", "[study.methods]"), r"study.toml:11: unknown key 'methods' in \[study\]"),
    # kPa written as Pa: below the triple point (611.657 Pa, IAPWS R14-08(2011))
    (("pressures_Pa = [101325.0, 300000.0]", "pressures_Pa = [101.325, 300]"),
     r"study.toml:5: \[study\] pressures_Pa: 101.325, 300 Pa outside the saturation range of water: 611.657\d* Pa "
     r"\(triple point.*\) to 2.2064e\+07 Pa \(critical point, IAPWS R6-95\(2018\)\); give them in Pa: they look "
     r"like kPa"),
    # above the critical pressure (22.064 MPa, IAPWS R6-95(2018)): no unit hint fits
    (("pressures_Pa = [101325.0, 300000.0]", "pressures_Pa = [101325.0, 3e7]"),
     r"study.toml:5: \[study\] pressures_Pa: 3e\+07 Pa outside .*\(critical point, IAPWS R6-95\(2018\)\)$"),
    # degrees Celsius written as kelvin: below the triple point (273.16 K)
    (("pressures_Pa = [101325.0, 300000.0]", "temperatures_K = [100.0, 130.0]"),
     r"study.toml:5: \[study\] temperatures_K: 100, 130 K outside .* 273.16 K \(triple point, IAPWS R14-08\(2011\)\) to 647.096 K.*degC"),
])
def test_spec_errors_are_one_line_and_leave_no_output(tmp_path, change, message):
    """Behavioural contract (the CLI's promise): spec errors come before anything is written, in one
    line naming the file and line; those of states name the value, the fluid's range and the likely
    unit slip (the range limits are those of IAPWS cited above). load_spec raises the same error for
    code that reads a spec itself."""
    import re

    from wetboil import WetboilValueError
    from wetboil.report import load_spec

    (tmp_path / "surfaces.csv").write_text("name,static_deg\nfrom csv (invented),30\n")
    spec = tmp_path / "study.toml"
    spec.write_text(SPEC.replace(*change))
    out = tmp_path / "out"
    r = run("run", str(spec), "--out", str(out))
    assert r.returncode == 1
    err = r.stderr.strip()
    assert len(err.splitlines()) == 1 and err.startswith("wetboil: error:"), err
    assert re.search(message, err), err
    assert not out.exists()
    with pytest.raises(WetboilValueError, match=message.replace("study.toml", r"study\.toml")):
        load_spec(spec)  # SpecError, or SurfaceFileError for a surface


def test_spec_method_that_does_not_fit_the_fluid_is_a_spec_error(tmp_path):
    """Bergles-Rohsenow is a correlation for water (Bergles and Rohsenow, J.
    Heat Transfer 86 (1964) 365-372); with another fluid the spec is refused
    before anything is written (behavioural contract)."""
    pytest.importorskip("CoolProp")
    from wetboil import cli

    spec = tmp_path / "study.toml"
    spec.write_text(SPEC.replace('fluid = "water"', 'fluid = "R134a"').replace("[101325.0, 300000.0]", "[3e5]")
                    .replace('onset = "kandlikar"', 'onset = "bergles_rohsenow"')
                    .replace('surfaces_file = "surfaces.csv"\n', ""))
    out = tmp_path / "out"
    assert cli.main(["run", str(spec), "--out", str(out)]) == 1
    assert not out.exists()


def test_bergles_rohsenow_onset_in_a_spec_runs(tmp_path):
    """Behavioural contract: every onset method offered in [methods] runs;
    Bergles-Rohsenow has no cavity radius (NaN)."""
    import numpy as np

    from wetboil.report import load_spec, run_study

    spec = tmp_path / "study.toml"
    spec.write_text(SPEC.replace('onset = "kandlikar"', 'onset = "bergles_rohsenow"')
                    .replace('surfaces_file = "surfaces.csv"\n', ""))
    study = load_spec(spec)
    report = run_study(study, tmp_path / "out", spec_text=spec.read_text())
    import xarray as xr

    ds = xr.load_dataset(tmp_path / "out" / "sweep.nc")
    assert np.isfinite(ds["onset_superheat"].values).all() and np.isnan(ds["onset_cavity_radius"].values).all()
    assert "bergles_rohsenow" in report.read_text()


def test_impossible_operating_points_are_counted_and_explained():
    """Behavioural contract: the command line's summary says how many
    operating points had no saturated state (here above the critical
    pressure, 22.064 MPa, IAPWS R6-95(2018)) and why; nothing when none."""
    import wetboil
    from wetboil.cli import impossible_summary

    s = [wetboil.Surface("a (invented)", 70, 80, 45), wetboil.Surface("b (invented)", 20, 30, 10)]
    with wetboil.errstate(invalid="ignore"):
        ds = wetboil.sweep(s, "water", p=[1e5, 3e7], heat_flux=[3e5, 4e5], orientation_deg=[0.0, 90.0])
    lines = impossible_summary(ds)
    assert len(lines) == 1
    assert lines[0].startswith("Impossible operating points: 4 of 8 (p = 3e+07 Pa) have no saturated state")
    assert "triple point to critical point" in lines[0]
    assert impossible_summary(wetboil.sweep(s, "water", p=[1e5], heat_flux=3e5)) == []


def test_failed_run_leaves_no_empty_output_folder(tmp_path, monkeypatch):
    """Behavioural contract: a run that fails after its checks removes the
    output folder it created (an empty folder looks like a run)."""
    from wetboil import cli, report

    (tmp_path / "surfaces.csv").write_text("name,static_deg\nfrom csv (invented),30\n")
    spec = tmp_path / "study.toml"
    spec.write_text(SPEC)

    def fail(*args, **kwargs):
        raise report.SpecError("simulated failure inside the run")

    monkeypatch.setattr(report, "run_study", fail)
    out = tmp_path / "out"
    assert cli.main(["run", str(spec), "--out", str(out)]) == 1
    assert not out.exists()
    kept = tmp_path / "kept"
    kept.mkdir()
    assert cli.main(["run", str(spec), "--out", str(kept)]) == 1
    assert kept.is_dir()  # a folder the user made is left alone


def test_an_output_folder_that_cannot_be_made_is_a_one_line_error(tmp_path, capsys):
    """Behavioural contract: --out naming a file, or a folder under one, is an error message with
    exit code 1, not a traceback."""
    from wetboil import cli

    a_file = tmp_path / "afile"
    a_file.write_text("not a folder")
    assert cli.main(["demo", "--out", str(a_file)]) == 1
    assert "is a file, not a folder" in capsys.readouterr().err
    assert cli.main(["demo", "--out", str(a_file / "below")]) == 1
    assert "cannot create the output folder" in capsys.readouterr().err
    assert a_file.read_text() == "not a folder"


FACING_DOWN_SPEC = """
[study]
title = "Facing-down check (invented)"
fluid = "water"
pressures_Pa = [101325.0, 500000.0]
heat_fluxes_W_m2 = [300000.0]
orientations_deg = [180.0, 0.0]

[[surface]]
name = "hydrophilic (invented)"
static_deg = 30.0
advancing_deg = 40.0
receding_deg = 20.0

[[surface]]
name = "hydrophobic (invented)"
static_deg = 120.0
advancing_deg = 130.0
receding_deg = 110.0
"""


def _run_keeping_figures(tmp_path, monkeypatch, spec_text):
    """Run a spec in-process and keep the figures the report draws (plt.close is skipped)."""
    import warnings

    import matplotlib.pyplot as plt

    from wetboil.report import load_spec, run_study

    figures = []
    monkeypatch.setattr(plt, "close", lambda fig=None: figures.append(fig))
    spec = tmp_path / "study.toml"
    spec.write_text(spec_text)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        report = run_study(load_spec(spec), tmp_path / "out", spec_text=spec_text)
    return report.read_text(), figures


def test_report_legend_names_only_surfaces_with_a_drawn_curve(tmp_path, monkeypatch):
    """Behavioural contract: a surface whose boiling curve has no critical heat flux gets neither a
    curve nor a legend entry, and the report says why. Facing down (180 deg) Kandlikar's CHF,
    q = K rho_v^0.5 h_fg [sigma g (rho_l - rho_v)]^0.25 with
    K = (1 + cos b)/16 [2/pi + (pi/4)(1 + cos b) cos phi]^0.5 (Kandlikar, J. Heat Transfer 123 (2001)
    1071-1079, eq. for K written from memory), has no real value for b = 20 deg
    (2/pi - (pi/4)(1.94) < 0) and one for b = 110 deg; the paper's validity is 0-90 deg."""
    import numpy as np

    text, figures = _run_keeping_figures(tmp_path, monkeypatch, FACING_DOWN_SPEC)
    curves, chf_plot = figures[0].axes[0], figures[1].axes[0]
    for ax in (curves, chf_plot):
        labels = [t.get_text() for t in ax.get_legend().get_texts()]
        drawn = {line.get_label(): line for line in ax.get_lines()}
        for label in labels:  # every legend entry has a line with values
            assert np.isfinite(np.asarray(drawn[label].get_ydata(), dtype=float)).any(), label
    labels = [t.get_text() for t in curves.get_legend().get_texts()]
    assert "hydrophobic (invented)" in labels and "hydrophilic (invented)" not in labels
    assert ("No curve: hydrophilic (invented) (Kandlikar (2001) CHF has no answer at receding angle 20.0 deg "
            "facing 180 deg") in text
    assert "No point: hydrophilic (invented)" in text
    assert "CAUTION" in text


def test_report_surfaces_table_names_its_pressures(tmp_path, monkeypatch):
    """Behavioural contract: with several pressures the surfaces table says at which pressure each
    angle holds: angles that change with pressure (predicted from probe liquids) are listed per
    pressure, in the order the caption names. Check against the physics outside the project: the
    surface tension of water falls with temperature (IAPWS R1-76(2014)), so the OWRK-predicted
    water angle of the same solid falls along the saturation line, 1 to 5 bar."""
    import re

    import xarray as xr

    from wetboil.demo import study_path

    text, _ = _run_keeping_figures(tmp_path, monkeypatch, study_path().read_text())
    assert "Working-fluid contact angles at each pressure: 1.01325 bar / 2 bar / 5 bar." in text
    row = next(line for line in text.splitlines() if line.startswith("| NV-E sintered-oxide primer |"))
    static = [float(v) for v in row.split("|")[2].split("/")]
    assert len(static) == 3 and static[0] > static[1] > static[2]
    ds = xr.load_dataset(tmp_path / "out" / "sweep.nc")
    want = ds["static_angle"].sel(surface="NV-E sintered-oxide primer").isel(heat_flux=0, orientation=0, subcooling=0)
    assert static == [round(float(v), 1) for v in want.values]
    # angles given for the working fluid do not change with pressure: one number
    row = next(line for line in text.splitlines() if line.startswith("| NV-A bare copper, as machined |"))
    assert re.match(r"\| NV-A bare copper, as machined \| 78\.0 \| 88\.0 \| 52\.0 \|", row)


def test_report_states_the_ranking_rule(tmp_path, monkeypatch):
    """Behavioural contract: the report says how surfaces are ranked, and keeps the CHF cautions."""
    from wetboil.report import CAUTION, RANKING_RULE

    text, _ = _run_keeping_figures(tmp_path, monkeypatch, FACING_DOWN_SPEC)
    assert RANKING_RULE in text and "higher is better" in RANKING_RULE and "below 1" in RANKING_RULE
    assert text.count(CAUTION) == 2
    ranking = text[text.index("## Ranking"):text.index("## Validity flags")]
    # predicted everywhere (flagged) before the surface without a prediction facing down
    assert ranking.index("| hydrophobic (invented) |") < ranking.index("| hydrophilic (invented) |")


def test_a_fluid_without_some_properties_runs_and_the_report_says_which(tmp_path, monkeypatch):
    """Behavioural contract: CoolProp has no surface-tension or transport model for some fluids
    (here Novec649, in the installed CoolProp): the run completes, and the report names the
    missing fields and the way to give them, instead of aborting or printing NaN unexplained."""
    CP = pytest.importorskip("CoolProp.CoolProp")
    try:
        CP.PropsSI("I", "P", 1e5, "Q", 0, "Novec649")
        pytest.skip("this CoolProp has a surface-tension model for Novec649")
    except ValueError:
        pass
    spec = ('[study]\nfluid = "Novec649"\npressures_Pa = [1e5]\nheat_fluxes_W_m2 = [1e5]\n'
            '[[surface]]\nname = "a (invented)"\nstatic_deg = 60.0\nadvancing_deg = 70.0\nreceding_deg = 40.0\n')
    text, _ = _run_keeping_figures(tmp_path, monkeypatch, spec)
    assert "fluid properties missing at every state (no model in CoolProp): sigma" in text
    assert "No curve: a (invented)" in text and "from_coolprop(...).replace(...)" in text


def test_probe_surfaces_in_a_fluid_without_a_tabulated_split_need_the_fraction(tmp_path, monkeypatch):
    """Behavioural contract: probe-liquid surfaces in R134a (no published dispersive/polar split) are a
    spec error until [study] dispersive_fraction is set; then the report states the value used."""
    pytest.importorskip("CoolProp")
    from wetboil.report import SpecError, load_spec

    spec = ('[study]\nfluid = "R134a"\npressures_Pa = [5e5]\nheat_fluxes_W_m2 = [1e5]\n'
            '[[surface]]\nname = "probe (invented)"\nprobe_static_deg = {water = 100.0, diiodomethane = 60.0}\n')
    path = tmp_path / "s.toml"
    path.write_text(spec)
    with pytest.raises(SpecError, match=r"s.toml:2: .*probe-liquid angles.*set \[study\] dispersive_fraction"):
        load_spec(path)
    path.write_text(spec.replace("[study]\n", "[study]\ndispersive_fraction = 1\n"))
    assert load_spec(path).dispersive_fraction == 1.0
    path.write_text(spec.replace("[study]\n", "[study]\ndispersive_fraction = 1.2\n"))
    with pytest.raises(SpecError, match="dispersive_fraction must lie in 0-1"):
        load_spec(path)
    text, _ = _run_keeping_figures(tmp_path, monkeypatch, spec.replace("[study]\n", "[study]\ndispersive_fraction = 0.8\n"))
    assert "dispersive fraction of its surface tension, for the angles predicted from probe liquids: 0.8 (given" in text


def test_report_names_each_surfaces_nucleate_correlation_and_the_subcooling_caveat(tmp_path, monkeypatch):
    """Behavioural contract: the report says which nucleate correlation each surface used with its
    constants (Rohsenow 1952 with C_sf and n, 1.7 for liquids other than water; Cooper 1984 with
    R_p), cites both under nucleate 'auto', and says subcooled rows carry saturated values."""
    spec = ('[study]\nfluid = "water"\npressures_Pa = [1e5]\nheat_fluxes_W_m2 = [3e5]\nsubcoolings_K = [0.0, 10.0]\n'
            '[[surface]]\nname = "a (invented)"\nstatic_deg = 60.0\nC_sf = 0.0068\nn = 1.0\n'
            '[[surface]]\nname = "b (invented)"\nstatic_deg = 30.0\nC_sf = 0.006\n'
            '[[surface]]\nname = "c (invented)"\nstatic_deg = 30.0\nRp = 2e-6\n')
    text, _ = _run_keeping_figures(tmp_path, monkeypatch, spec)
    assert "| Rohsenow, C_sf 0.0068, n 1 |" in text
    assert "| Rohsenow, C_sf 0.006, n 1 (the fluid's) |" in text
    assert "| Cooper, R_p 2 um |" in text
    assert "nucleate: auto (cooper)** -- M.G. Cooper" in text and "nucleate: auto (rohsenow)** -- W.M. Rohsenow" in text
    assert "subcooled rows carry the saturated values" in text


def test_report_names_the_incipience_overshoot(tmp_path, monkeypatch):
    """Behavioural contract: where the onset superheat (Hsu 1962) exceeds the nucleate superheat
    (Cooper 1984) at the design flux, the report names the overshoot (boiling hysteresis) with its
    size, the difference of the two public functions."""
    from wetboil.boiling import cooper_superheat
    from wetboil.fluids import water
    from wetboil.nucleation import onset_superheat

    w = water(p=101325.0)
    over = onset_superheat(3e5, w, 48.9, method="hsu") - cooper_superheat(3e5, w, 4e-6)
    assert over > 0
    spec = ('[study]\nfluid = "water"\npressures_Pa = [101325.0]\nheat_fluxes_W_m2 = [3e5]\n'
            '[[surface]]\nname = "d (invented)"\nstatic_deg = 48.9\nadvancing_deg = 64.4\nreceding_deg = 20.5\n'
            'Rp = 4e-6\n'
            '[[surface]]\nname = "e (invented)"\nstatic_deg = 60.0\nC_sf = 0.013\n')
    text, _ = _run_keeping_figures(tmp_path, monkeypatch, spec)
    assert f"Largest overshoot per surface: d (invented) {over:.1f} K." in text


def test_command_line_prints_each_warning_once_on_one_line(tmp_path, capsys):
    """Behavioural contract: warnings reach a command's user as one 'wetboil: <Category>: ...' line
    each, without Python source lines; the report's figures do not repeat the sweep's warnings.
    (A spec whose fluid lacks properties in CoolProp, here Novec649, gives exactly one.)"""
    from wetboil import cli

    CP = pytest.importorskip("CoolProp.CoolProp")
    try:
        CP.PropsSI("I", "P", 1e5, "Q", 0, "Novec649")
        pytest.skip("this CoolProp has a surface-tension model for Novec649")
    except ValueError:
        pass
    spec = tmp_path / "s.toml"
    spec.write_text('[study]\nfluid = "Novec649"\npressures_Pa = [1e5]\nheat_fluxes_W_m2 = [1e5]\n'
                    '[[surface]]\nname = "a (invented)"\nstatic_deg = 60.0\nadvancing_deg = 70.0\nreceding_deg = 40.0\n')
    assert cli.main(["run", str(spec), "--out", str(tmp_path / "out")]) == 0
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1 and err[0].startswith("wetboil: WetboilWarning: fluids.from_coolprop: CoolProp has no sigma"), err


def test_report_curves_follow_the_studys_nucleate_method(tmp_path, monkeypatch):
    """Behavioural contract: the boiling-curve figure draws each surface with the nucleate
    correlation the sweep used (here "cooper" for a surface that also has a C_sf): its nucleate
    branch is boiling.curve's Cooper (1984) branch."""
    import numpy as np

    from wetboil import boiling
    from wetboil.fluids import water

    spec = ('[study]\nfluid = "water"\npressures_Pa = [101325.0]\nheat_fluxes_W_m2 = [3e5]\n'
            '[methods]\nnucleate = "cooper"\n'
            '[[surface]]\nname = "a (invented)"\nstatic_deg = 60.0\nadvancing_deg = 70.0\nreceding_deg = 40.0\n'
            'C_sf = 0.0068\n')
    _, figures = _run_keeping_figures(tmp_path, monkeypatch, spec)
    line = next(l for l in figures[0].axes[0].get_lines() if l.get_label() == "a (invented)")
    dts = np.asarray(line.get_xdata(), dtype=float)
    for nucleate, same in (("cooper", True), ("rohsenow", False)):
        c = boiling.curve(water(p=101325.0), dts, receding_angle_deg=40.0, contact_angle_deg=60.0, nucleate=nucleate,
                          C_sf=0.0068, natural_convection_coefficient=1000.0, design_heat_flux=3e5)
        assert np.allclose(np.asarray(line.get_ydata(), dtype=float), c["heat_flux"].values, equal_nan=True) == same
