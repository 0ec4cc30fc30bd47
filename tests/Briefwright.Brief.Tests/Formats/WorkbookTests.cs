using System.Globalization;
using System.Text.Json;
using Briefwright.Brief.Formats;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using DocumentFormat.OpenXml.Validation;

namespace Briefwright.Brief.Tests.Formats;

/// <summary>The spreadsheet annex read back with the Open XML SDK and compared with the results data.</summary>
public class WorkbookTests
{
    private sealed record Book(
        Dictionary<string, List<List<Cell>>> Sheets,
        Dictionary<string, Worksheet> Worksheets,
        Stylesheet Styles);

    private static Book Read(byte[] bytes)
    {
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var part = doc.WorkbookPart!;
        var sheets = new Dictionary<string, List<List<Cell>>>();
        var worksheets = new Dictionary<string, Worksheet>();
        foreach (var s in part.Workbook.Sheets!.Elements<Sheet>())
        {
            var ws = ((WorksheetPart)part.GetPartById(s.Id!)).Worksheet;
            worksheets[s.Name!] = (Worksheet)ws.CloneNode(true);
            sheets[s.Name!] = ws.Descendants<Row>()
                .Select(r => r.Elements<Cell>().Select(c => (Cell)c.CloneNode(true)).ToList())
                .ToList();
        }
        return new Book(sheets, worksheets, (Stylesheet)part.WorkbookStylesPart!.Stylesheet.CloneNode(true));
    }

    private static string Text(Cell c)
        => c.DataType?.Value == CellValues.InlineString ? c.InlineString!.InnerText : c.CellValue?.Text ?? "";

    private static double Number(Cell c)
    {
        Assert.Null(c.DataType); // a number cell, not text
        return double.Parse(c.CellValue!.Text, CultureInfo.InvariantCulture);
    }

    private static Cell At(List<Cell> row, string column)
        => row.Single(c => c.CellReference!.Value!.TrimEnd("0123456789".ToCharArray()) == column);

    private static string FormatCode(Book book, Cell c)
    {
        var xf = book.Styles.CellFormats!.Elements<CellFormat>().ElementAt((int)(c.StyleIndex?.Value ?? 0));
        uint id = xf.NumberFormatId!.Value;
        return book.Styles.NumberingFormats?.Elements<NumberingFormat>()
            .FirstOrDefault(f => f.NumberFormatId!.Value == id)?.FormatCode!
            .Value
            ?? id switch { 0 => "General", 1 => "0", 10 => "0.00%", 49 => "@", _ => $"builtin {id}" };
    }

    private static readonly Lazy<(Book Book, JsonElement Json, byte[] Bytes)> National = new(() =>
    {
        var brief = FormatsDemo.National;
        byte[] bytes = FormatsDemo.File(brief, "xlsx");
        return (Read(bytes), FormatsDemo.Json(brief), bytes);
    });

    [Fact]
    public void Workbook_is_valid_and_has_a_sheet_per_table_after_the_about_sheet()
    {
        var (book, _, bytes) = National.Value;
        Assert.Equal(new[] {
            "About",
            "Assumptions",
            "Options",
            "Reform paths",
            "Present values",
            "Sensitivity",
            "Monte Carlo",
            "Sobol" }, book.Sheets.Keys);
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var errors = new OpenXmlValidator(DocumentFormat.OpenXml.FileFormatVersions.Office2019).Validate(doc).ToList();
        Assert.True(
            errors.Count == 0,
            string.Join("\n", errors.Take(20).Select(e => $"{e.Part?.Uri} {e.Path?.XPath}: {e.Description}")));
    }

    [Fact]
    public void About_sheet_names_scenario_edition_and_input_hash()
    {
        var (book, json, _) = National.Value;
        var about = book.Sheets["About"].Skip(1).ToDictionary(r => Text(r[0]), r => Text(r[1]));
        Assert.Equal(json.GetProperty("scenario_id").GetString(), about["Scenario"]);
        Assert.Equal(json.GetProperty("input_hash").GetString(), about["Input hash (SHA-256)"]);
        Assert.StartsWith(
            json.GetProperty("edition").GetInt32().ToString(CultureInfo.InvariantCulture) + " (",
            about["Edition"]);
        Assert.Equal(json.GetProperty("date").GetString(), about["Date"]);
        Assert.Contains("not forecasts", about["Caution"]);
    }

    [Fact]
    public void Every_sheet_freezes_its_header_row_and_no_cell_is_a_formula()
    {
        var (book, _, _) = National.Value;
        foreach (var (name, ws) in book.Worksheets)
        {
            var pane = ws.Descendants<Pane>().Single();
            Assert.Equal(PaneStateValues.Frozen, pane.State!.Value);
            Assert.Equal(1.0, pane.VerticalSplit!.Value);
            Assert.Equal("A2", pane.TopLeftCell!.Value);
            Assert.Empty(ws.Descendants<CellFormula>());
            foreach (var c in ws.Descendants<Cell>())
                Assert.True(
                    c.DataType is null || c.DataType.Value == CellValues.InlineString,
                    $"{name}!{c.CellReference}: {c.DataType?.Value}");
        }
    }

    [Fact]
    public void Text_that_looks_like_a_formula_stays_text()
    {
        var table = new SheetTable(
            "T",
            "a test sheet",
            [new("Label", ColumnKind.Text), new("Value (%)", ColumnKind.Percent)],
            [new object?[] { "=SUM(1,2)", 0.5 }, new object?[] { "-1+2", -0.25 }]);
        var book = Read(WorkbookWriter.Write(
            [table],
            new DateOnly(2026, 11, 30),
            "Invented org",
            "t",
            new Composer.Layout.Rgb(1, 2, 3)));
        var rows = book.Sheets["T"];
        Assert.Equal("=SUM(1,2)", Text(rows[1][0]));
        Assert.Equal(CellValues.InlineString, rows[1][0].DataType!.Value);
        var xf = book.Styles.CellFormats!.Elements<CellFormat>().ElementAt((int)rows[1][0].StyleIndex!.Value);
        Assert.True(xf.QuotePrefix?.Value); // kept as text when the cell is edited
        Assert.Equal(-0.25, Number(rows[2][1]));
        Assert.Equal("0.0%", FormatCode(book, rows[2][1]));
    }

    [Fact]
    public void Options_sheet_equals_the_results_data_with_change_as_a_percent()
    {
        var (book, json, _) = National.Value;
        var rows = book.Sheets["Options"];
        Assert.Equal("Change vs baseline (%)", Text(At(rows[0], "H")));
        Assert.Equal("Schooling (years)", Text(At(rows[0], "D")));
        var options = json.GetProperty("options").EnumerateArray().ToList();
        Assert.Equal(options.Count, rows.Count - 1);
        for (int i = 0; i < options.Count; i++)
        {
            var o = options[i];
            var row = rows[i + 1];
            Assert.Equal(o.GetProperty("id").GetString(), Text(At(row, "A")));
            Assert.Equal(o.GetProperty("label").GetString(), Text(At(row, "B")));
            Assert.Equal(o.GetProperty("schooling_years").GetDouble(), Number(At(row, "D")));
            Assert.Equal(o.GetProperty("worker_share").GetDouble(), Number(At(row, "E")));
            Assert.Equal(o.GetProperty("human_capital_per_worker").GetDouble(), Number(At(row, "F")));
            Assert.Equal(o.GetProperty("output_per_person").GetDouble(), Number(At(row, "G")));
            Assert.Equal(o.GetProperty("change_vs_baseline_pct").GetDouble() / 100, Number(At(row, "H")), 15);
            Assert.Equal("0.0%", FormatCode(book, At(row, "H")));
        }
    }

    [Fact]
    public void Reform_paths_present_values_and_monte_carlo_equal_the_results_data()
    {
        var (book, json, _) = National.Value;
        var reform = json.GetProperty("analysis").GetProperty("reform");
        var paths = reform.GetProperty("options").EnumerateArray().ToList();
        var rows = book.Sheets["Reform paths"];
        int reformYear = reform.GetProperty("reform_year").GetInt32();
        for (int k = 0; k < paths.Count; k++)
        {
            var gains = paths[k].GetProperty("path").GetProperty("gain").EnumerateArray().Select(g => g.GetDouble())
                .ToList();
            Assert.Equal(gains.Count, rows.Count - 1);
            for (int t = 0; t < gains.Count; t++)
            {
                Assert.Equal(reformYear + t, Number(rows[t + 1][0]));
                Assert.Equal(gains[t], Number(rows[t + 1][2 + k]));
            }
            Assert.Equal("0.0%", FormatCode(book, rows[1][2 + k]));
            Assert.EndsWith("change vs no reform (%)", Text(rows[0][2 + k]));
        }

        var pvRows = book.Sheets["Present values"].Skip(1).ToList();
        var pvs = paths.SelectMany(p => p.GetProperty("present_values").EnumerateArray()
            .Select(v => (Id: p.GetProperty("option_id").GetString(), V: v))).ToList();
        Assert.Equal(pvs.Count, pvRows.Count);
        for (int i = 0; i < pvs.Count; i++)
        {
            Assert.Equal(pvs[i].Id, Text(At(pvRows[i], "A")));
            Assert.Equal(pvs[i].V.GetProperty("schedule_label").GetString(), Text(At(pvRows[i], "C")));
            Assert.Equal(pvs[i].V.GetProperty("to_horizon").GetDouble(), Number(At(pvRows[i], "F")));
            if (pvs[i].V.GetProperty("break_even_calendar_year").ValueKind == JsonValueKind.Number)
                Assert.Equal(pvs[i].V.GetProperty("break_even_calendar_year").GetDouble(), Number(At(pvRows[i], "I")));
        }

        var mc = json.GetProperty("analysis").GetProperty("monte_carlo").GetProperty("options").EnumerateArray()
            .ToList();
        var mcRows = book.Sheets["Monte Carlo"].Skip(1).ToList();
        for (int k = 0; k < mc.Count; k++)
        {
            var change = mc[k].GetProperty("long_run_change_pct");
            var row = mcRows[2 * k];
            Assert.Equal(change.GetProperty("p5").GetDouble() / 100, Number(At(row, "D")), 15);
            Assert.Equal(change.GetProperty("p50").GetDouble() / 100, Number(At(row, "F")), 15);
            Assert.Equal(change.GetProperty("p95").GetDouble() / 100, Number(At(row, "H")), 15);
            Assert.Equal("0.0%", FormatCode(book, At(row, "F")));
            var pv = mc[k].GetProperty("present_value");
            Assert.Equal(pv.GetProperty("p50").GetDouble(), Number(At(mcRows[2 * k + 1], "F")));
        }
    }

    [Fact]
    public void Assumptions_sheet_holds_every_assumption_with_its_source_and_rates_as_percents()
    {
        var (book, json, _) = National.Value;
        var rows = book.Sheets["Assumptions"].Skip(1).ToList();
        var assumptions = json.GetProperty("assumptions").EnumerateArray().ToList();
        Assert.Equal(assumptions.Count, rows.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var a = assumptions[i];
            Assert.Equal(a.GetProperty("path").GetString(), Text(At(rows[i], "A")));
            if (a.GetProperty("source").GetString() is { } source) Assert.Equal(source, Text(At(rows[i], "F")));
            if (a.GetProperty("value").ValueKind == JsonValueKind.Number)
            {
                var cell = At(rows[i], "C");
                Assert.Equal(a.GetProperty("value").GetDouble(), Number(cell));
                Assert.Equal(a.GetProperty("unit").GetString() == "rate" ? "0.0%" : "General", FormatCode(book, cell));
            }
        }
    }
}
