"""The command line and the built-in demo scenario, run as a user would."""

import subprocess
import sys

import pytest

pytest.importorskip("matplotlib")


def run(*args, cwd=None):
    return subprocess.run([sys.executable, "-m", "wetboil", *args], capture_output=True, text=True, timeout=300, cwd=cwd)


def test_help_on_every_command():
    r = run("--help")
    assert r.returncode == 0 and "demo" in r.stdout and "CAUTION" in r.stdout
    r = run("demo", "--help")
    assert r.returncode == 0 and "--out" in r.stdout


def test_demo_end_to_end(tmp_path):
    out = tmp_path / "demo"
    r = run("demo", "--out", str(out))
    assert r.returncode == 0, r.stderr
    from wetboil.demo import load_scenario

    names = [s["name"] for s in load_scenario()["surface"]]
    for name in names:
        assert name in r.stdout
    assert "CAUTION" in r.stdout and "report" in r.stdout.lower()
    png = out / "chf_vs_receding_angle.png"
    assert png.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n" and png.stat().st_size > 10_000
    report = (out / "report.md").read_text()
    assert all(name in report for name in names)
    assert "Kandlikar" in report and "doi:10.1115/1.1409265" in report and "CAUTION" in report


def test_demo_default_folder_is_new(tmp_path):
    r = run("demo", cwd=tmp_path)
    assert r.returncode == 0, r.stderr
    made = [p for p in tmp_path.iterdir() if p.name.startswith("wetboil-demo-")]
    assert len(made) == 1 and (made[0] / "report.md").exists()


def test_demo_scenario_is_labelled_invented():
    from wetboil.demo import load_scenario

    sc = load_scenario()
    assert "invented" in sc["scenario"]["lab"] and "invented" in sc["scenario"]["title"]
