"""Execute every notebook in notebooks/ from top to bottom (a worked scenario
that stops running is a broken example). Outputs are not compared: the
notebooks carry their own assertions where a number matters."""

import pathlib

import pytest

nbformat = pytest.importorskip("nbformat")
nbclient = pytest.importorskip("nbclient")

NOTEBOOKS = sorted((pathlib.Path(__file__).parent.parent / "notebooks").glob("*.ipynb"))


@pytest.mark.parametrize("path", NOTEBOOKS, ids=[p.stem for p in NOTEBOOKS])
def test_notebook_runs(path, tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)  # notebooks write their files here, not into the repo
    monkeypatch.setenv("MPLBACKEND", "Agg")
    nb = nbformat.read(path, as_version=4)
    client = nbclient.NotebookClient(nb, timeout=600, kernel_name="python3", resources={"metadata": {"path": str(tmp_path)}})
    client.execute()
