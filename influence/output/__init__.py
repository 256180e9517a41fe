"""Everything a person reads: tables (text, CSV, JSON), figures and the PDF report. Only the
figure and report modules import matplotlib, and only when they are used."""
