using System.Globalization;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace Briefwright.Brief.Formats;

/// <summary>How a column's cells are written and shown.</summary>
public enum ColumnKind
{
    Text,

    /// <summary>A whole number such as a calendar year or a count (format <c>0</c>).</summary>
    Whole,

    /// <summary>A number as the spreadsheet program shows it (all its digits); for columns whose values differ in size.</summary>
    General,

    /// <summary>A number shown with three decimals.</summary>
    Number,

    /// <summary>A share stored as a fraction and shown as a percent (<c>0.0%</c>): 0.041 shows as 4.1%.</summary>
    Percent,

    /// <summary>Yes or no, as text.</summary>
    YesNo,
}

/// <summary>A column of a sheet: its header (with the unit) and kind.</summary>
public sealed record SheetColumn(string Header, ColumnKind Kind, double Width = 14);

/// <summary>One sheet of the workbook: a header row and rows of values (strings, numbers, booleans or null for an empty cell).</summary>
public sealed record SheetTable(string Name, string Description, IReadOnlyList<SheetColumn> Columns, IReadOnlyList<IReadOnlyList<object?>> Rows);

/// <summary>
/// The spreadsheet annex: one workbook per brief, a first sheet saying what it is (scenario, edition, date, input hash,
/// the cautions) and a sheet per results table. Units are in the headers, shares are stored as fractions and shown as
/// percents, the header row is frozen, and every text is a typed text cell (never a formula; text a spreadsheet program
/// would read as one on editing carries the quote prefix). Same content, same bytes: the package's dates are the
/// brief's, and the zip entries are stamped with it.
/// </summary>
public sealed class WorkbookWriter : IBriefWriter
{
    public string Suffix => "xlsx";

    public byte[] Write(BriefContent content) =>
        Write(Tables(content), content.Solved.Scenario.Brief.Date, content.OrganisationName, content.Document.Info.Title, content.Theme.HeaderFill);

    /// <summary>The sheets of a brief's workbook, the "About" sheet first.</summary>
    public static IReadOnlyList<SheetTable> Tables(BriefContent content)
    {
        var solved = content.Solved;
        var scenario = solved.Scenario;
        var brief = scenario.Brief;
        var a = solved.Analysis;
        var labels = solved.BalancedGrowth.Options.ToDictionary(o => o.Id, o => o.Label, StringComparer.Ordinal);
        string Label(string id) => labels.GetValueOrDefault(id, id);
        var tables = new List<SheetTable>();

        var sheets = new List<(string, string)>
        {
            ("Assumptions", "Every assumption of the scenario with its unit and source."),
            ("Options", "Each option once the economy has adjusted (balanced growth path)."),
            ("Reform paths", "Output per person against no reform, year by year after the reform, per option."),
            ("Present values", "Discounted value of each option's gain, per discount schedule, in years of output per person."),
        };
        if (a.Tornado.Count > 0) sheets.Add(("Sensitivity", "Each option's long-run change with one assumption at the low and high end of its range."));
        if (a.MonteCarlo is not null) sheets.Add(("Monte Carlo", "Percentiles over the Monte Carlo draws, with the probability of a gain."));
        if (a.Sobol is not null) sheets.Add(("Sobol", "Which assumption matters most: Sobol indices with their bootstrap intervals."));
        var about = new List<IReadOnlyList<object?>>
        {
            Row("What this is", $"The spreadsheet annex of the brief \"{brief.Title}\": its results tables as numbers, from the same run as the brief."),
            Row("Scenario", brief.Id),
            Row("Date", brief.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)),
            Row("Edition", $"{brief.Edition} ({brief.Status})"),
            Row("Organisation", content.OrganisationName),
            Row("Input hash (SHA-256)", scenario.InputHash),
            Row("Tool", $"briefwright {ToolInfo.Version}"),
            Row("Caution", "Results are model illustrations under stated assumptions, not forecasts; official statistics and the commissioning body's own appraisal rules prevail."),
            Row("Units", "Each header names its unit. Shares are stored as fractions and shown as percents (a cell showing 4.1% holds 0.041)."),
        };
        about.AddRange(sheets.Select(s => Row("Sheet: " + s.Item1, s.Item2)));
        tables.Add(new SheetTable("About", "What this workbook is.", [new("Item", ColumnKind.Text, 24), new("Value", ColumnKind.Text, 100)], about));

        tables.Add(new SheetTable("Assumptions", sheets[0].Item2,
            [new("Path", ColumnKind.Text, 34), new("Label", ColumnKind.Text, 34), new("Value (percent for rates)", ColumnKind.General, 14),
             new("Value as text", ColumnKind.Text, 18), new("Unit", ColumnKind.Text, 10), new("Source", ColumnKind.Text, 50), new("Note", ColumnKind.Text, 50)],
            scenario.Assumptions.Select(x => Row(x.Path, x.Label, x.Unit == ValueUnit.Rate && x.Value is { } v ? new PercentValue(v) : x.Value, x.Text,
                x.Unit.ToString().ToLowerInvariant(), x.Source, x.Note)).ToList()));

        tables.Add(new SheetTable("Options", sheets[1].Item2,
            [new("Option id", ColumnKind.Text, 20), new("Option", ColumnKind.Text, 34), new("Baseline", ColumnKind.YesNo, 10), new("Schooling (years)", ColumnKind.Number),
             new("Workers per person (fraction)", ColumnKind.Number, 16), new("Human capital per worker (index)", ColumnKind.Number, 16),
             new("Output per person (model units)", ColumnKind.Number, 16), new("Change vs baseline (%)", ColumnKind.Percent, 16)],
            solved.BalancedGrowth.Options.Select(o => Row(o.Id, o.Label, o.IsBaseline, o.SchoolingYears, o.WorkerShare, o.HumanCapitalPerWorker, o.OutputPerPerson, o.ChangeVsBaselinePct / 100)).ToList()));

        var reform = a.Reform;
        int years = reform.Options.Count == 0 ? 0 : reform.Options.Max(o => o.Path.Gain.Length);
        tables.Add(new SheetTable("Reform paths", sheets[2].Item2,
            new[] { new SheetColumn("Calendar year", ColumnKind.Whole, 12), new SheetColumn("Years after reform", ColumnKind.Whole, 12) }
                .Concat(reform.Options.Select(o => new SheetColumn($"{Label(o.OptionId)}: change vs no reform (%)", ColumnKind.Percent, 22))).ToList(),
            Enumerable.Range(0, years).Select(t => (IReadOnlyList<object?>)new object?[] { reform.ReformYear + t, t }
                .Concat(reform.Options.Select(o => t < o.Path.Gain.Length ? (object?)o.Path.Gain[t] : null)).ToList()).ToList()));

        tables.Add(new SheetTable("Present values", sheets[3].Item2,
            [new("Option id", ColumnKind.Text, 20), new("Option", ColumnKind.Text, 30), new("Discount schedule", ColumnKind.Text, 36), new("Valuation year", ColumnKind.Whole, 10),
             new("Discount factor to the reform year (fraction)", ColumnKind.Number, 16), new("To the horizon (years of output per person)", ColumnKind.Number, 18),
             new("Tail beyond the horizon (years of output per person)", ColumnKind.Number, 18), new("Total (years of output per person)", ColumnKind.Number, 18),
             new("Pays back (calendar year)", ColumnKind.Whole, 12)],
            reform.Options.SelectMany(o => o.PresentValues.Select(p => Row(o.OptionId, Label(o.OptionId), p.ScheduleLabel, p.ValuationYear, p.DiscountFactorToReform,
                p.ToHorizon, p.Tail, p.Total, p.BreakEvenCalendarYear))).ToList()));

        if (a.Tornado.Count > 0)
            tables.Add(new SheetTable("Sensitivity", sheets.First(s => s.Item1 == "Sensitivity").Item2,
                [new("Assumption", ColumnKind.Text, 30), new("Parameter", ColumnKind.Text, 22), new("Low (percent for rates)", ColumnKind.General), new("High (percent for rates)", ColumnKind.General),
                 new("Option", ColumnKind.Text, 30), new("Change at low (%)", ColumnKind.Percent), new("Change at high (%)", ColumnKind.Percent),
                 new("Optimum at low (years)", ColumnKind.Number), new("Optimum at high (years)", ColumnKind.Number)],
                a.Tornado.SelectMany(t => t.AtLow.OptionIds.Select((id, k) =>
                {
                    bool rate = Model.Uncertainty.Parameters.Find(t.Parameter)?.IsRate == true;
                    return Row(t.Label, t.Parameter, rate ? new PercentValue(t.Low) : t.Low, rate ? new PercentValue(t.High) : t.High, Label(id),
                        t.AtLow.LongRunChangePct[k] / 100, t.AtHigh.LongRunChangePct[k] / 100, t.AtLow.OptimumYears, t.AtHigh.OptimumYears);
                })).ToList()));

        if (a.MonteCarlo is { } mc)
        {
            var rows = new List<IReadOnlyList<object?>>();
            foreach (var o in mc.Options)
            {
                rows.Add(McRow("Long-run change in output per person", "percent", Label(o.OptionId), o.LongRunChangePct, 0.01, o.ProbabilityGain));
                rows.Add(McRow("Present value to the horizon", "years of output per person", Label(o.OptionId), o.PresentValue, 1, o.ProbabilityPositivePv));
            }
            rows.Add(McRow("Output-maximising schooling", "years", "", mc.OptimumYears, 1, null));
            tables.Add(new SheetTable("Monte Carlo", sheets.First(s => s.Item1 == "Monte Carlo").Item2,
                [new("Result", ColumnKind.Text, 34), new("Unit (percent cells hold fractions)", ColumnKind.Text, 24), new("Option", ColumnKind.Text, 30),
                 new("5th percentile", ColumnKind.Number), new("25th percentile", ColumnKind.Number), new("Median", ColumnKind.Number), new("75th percentile", ColumnKind.Number),
                 new("95th percentile", ColumnKind.Number), new("Mean", ColumnKind.Number), new("Probability positive (%)", ColumnKind.Percent),
                 new("Probability, 95% interval low (%)", ColumnKind.Percent), new("Probability, 95% interval high (%)", ColumnKind.Percent), new("Draws", ColumnKind.Whole, 10)],
                rows));
        }

        if (a.Sobol is { } sobol)
            tables.Add(new SheetTable("Sobol", sheets.First(s => s.Item1 == "Sobol").Item2,
                [new("Output", ColumnKind.Text, 30), new("Parameter", ColumnKind.Text, 22), new("First-order share (%)", ColumnKind.Percent), new("First-order low (%)", ColumnKind.Percent),
                 new("First-order high (%)", ColumnKind.Percent), new("Total share (%)", ColumnKind.Percent), new("Total low (%)", ColumnKind.Percent), new("Total high (%)", ColumnKind.Percent),
                 new("Confidence level (%)", ColumnKind.Percent), new("Base samples", ColumnKind.Whole)],
                sobol.Outputs.SelectMany((output, k) => sobol.Indices[k].Inputs.Select((name, i) =>
                {
                    var x = sobol.Indices[k];
                    return Row(output, name, x.FirstOrder[i], x.FirstOrderLow[i], x.FirstOrderHigh[i], x.Total[i], x.TotalLow[i], x.TotalHigh[i], x.Level, x.Samples);
                })).ToList()));
        return tables;
    }

    /// <summary>A value in a number column that is a rate: stored as a fraction, shown as a percent.</summary>
    public sealed record PercentValue(double Fraction);

    private static IReadOnlyList<object?> Row(params object?[] cells) => cells;

    private static IReadOnlyList<object?> McRow(string result, string unit, string option, PercentileSummary s, double scale, Probability? p)
    {
        object? V(double x) => scale == 1 ? x : new PercentValue(x * scale);
        return Row(result, unit, option, V(s.P5), V(s.P25), V(s.P50), V(s.P75), V(s.P95), V(s.Mean), p?.Estimate, p?.Low, p?.High, p?.Draws);
    }

    // Cell formats (indices into the stylesheet's cellXfs).
    private const uint General = 0, Header = 1, PercentFormat = 2, NumberFormat = 3, WholeFormat = 4, WrapText = 5, QuotedText = 6;

    public static byte[] Write(IReadOnlyList<SheetTable> tables, DateOnly date, string organisation, string title, Composer.Layout.Rgb headerFill)
    {
        using var stream = new MemoryStream();
        using (var doc = SpreadsheetDocument.Create(stream, SpreadsheetDocumentType.Workbook))
        {
            var book = doc.AddNewPart<WorkbookPart>("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml", "rId1");
            var styles = book.AddNewPart<WorkbookStylesPart>("rIdStyles");
            styles.Stylesheet = Stylesheet($"FF{headerFill.R:X2}{headerFill.G:X2}{headerFill.B:X2}");
            var sheets = new Sheets();
            for (int i = 0; i < tables.Count; i++)
            {
                string rid = $"rIdSheet{i + 1}";
                var part = book.AddNewPart<WorksheetPart>(rid);
                part.Worksheet = Worksheet(tables[i]);
                sheets.Append(new Sheet { Name = tables[i].Name, SheetId = (uint)(i + 1), Id = rid });
            }
            book.Workbook = new Workbook(new BookViews(new WorkbookView()), sheets);
            ZipStamp.CoreProperties(doc, title, organisation, date);
        }
        return ZipStamp.Restamp(stream.ToArray(), date);
    }

    private static Worksheet Worksheet(SheetTable table)
    {
        var view = new SheetView { WorkbookViewId = 0, TabSelected = table.Name == "About" };
        view.Append(new Pane { VerticalSplit = 1, TopLeftCell = "A2", ActivePane = PaneValues.BottomLeft, State = PaneStateValues.Frozen });
        view.Append(new Selection { Pane = PaneValues.BottomLeft, ActiveCell = "A2", SequenceOfReferences = new ListValue<StringValue>(["A2"]) });
        var columns = new Columns(table.Columns.Select((c, i) => new Column { Min = (uint)(i + 1), Max = (uint)(i + 1), Width = c.Width, CustomWidth = true }));
        var data = new SheetData();
        var header = new Row { RowIndex = 1 };
        for (int c = 0; c < table.Columns.Count; c++) header.Append(TextCell(Ref(c, 1), table.Columns[c].Header, Header));
        data.Append(header);
        for (int r = 0; r < table.Rows.Count; r++)
        {
            uint index = (uint)(r + 2);
            var row = new Row { RowIndex = index };
            var cells = table.Rows[r];
            for (int c = 0; c < cells.Count && c < table.Columns.Count; c++)
                if (Cell(Ref(c, index), cells[c], table.Columns[c].Kind, table.Name == "About") is { } cell) row.Append(cell);
            data.Append(row);
        }
        var sheet = new Worksheet(new SheetViews(view), new SheetFormatProperties { DefaultRowHeight = 15 }, columns, data);
        if (table.Rows.Count > 0)
            sheet.Append(new AutoFilter { Reference = $"A1:{Ref(table.Columns.Count - 1, (uint)(table.Rows.Count + 1))}" });
        return sheet;
    }

    private static Cell? Cell(string reference, object? value, ColumnKind kind, bool wrap) => value switch
    {
        null => null,
        string s => TextCell(reference, s, wrap ? WrapText : General),
        bool b => TextCell(reference, b ? "yes" : "no", General),
        PercentValue p => NumberCell(reference, p.Fraction, PercentFormat),
        double d when !double.IsFinite(d) => null,
        double d => NumberCell(reference, d, kind switch { ColumnKind.Percent => PercentFormat, ColumnKind.Whole => WholeFormat, ColumnKind.General => General, _ => NumberFormat }),
        int i => NumberCell(reference, i, kind == ColumnKind.Percent ? PercentFormat : WholeFormat),
        _ => TextCell(reference, Convert.ToString(value, CultureInfo.InvariantCulture) ?? "", General),
    };

    private static Cell NumberCell(string reference, double value, uint style) =>
        new() { CellReference = reference, StyleIndex = style, CellValue = new CellValue(value.ToString("R", CultureInfo.InvariantCulture)) };

    /// <summary>A typed text cell; text that starts like a formula gets the quote prefix, so editing the cell keeps it text.</summary>
    private static Cell TextCell(string reference, string text, uint style)
    {
        bool formulaLike = text.Length > 0 && text[0] is '=' or '+' or '-' or '@' or '\t' or '\r';
        var t = new Text(text);
        if (text.Length > 0 && (char.IsWhiteSpace(text[0]) || char.IsWhiteSpace(text[^1]))) t.Space = SpaceProcessingModeValues.Preserve;
        return new Cell
        {
            CellReference = reference, DataType = CellValues.InlineString, InlineString = new InlineString(t),
            StyleIndex = formulaLike && style == General ? QuotedText : style,
        };
    }

    public static string Ref(int column, uint row)
    {
        string letters = "";
        for (int c = column + 1; c > 0; c = (c - 1) / 26) letters = (char)('A' + (c - 1) % 26) + letters;
        return letters + row.ToString(CultureInfo.InvariantCulture);
    }

    private static Stylesheet Stylesheet(string headerArgb) => new(
        new NumberingFormats(
            new NumberingFormat { NumberFormatId = 164, FormatCode = "0.0%" },
            new NumberingFormat { NumberFormatId = 165, FormatCode = "0.000" }) { Count = 2 },
        new Fonts(
            new Font(new FontSize { Val = 10 }, new FontName { Val = "Liberation Sans" }),
            new Font(new Bold(), new FontSize { Val = 10 }, new FontName { Val = "Liberation Sans" })) { Count = 2 },
        new Fills(
            new Fill(new PatternFill { PatternType = PatternValues.None }),
            new Fill(new PatternFill { PatternType = PatternValues.Gray125 }),
            new Fill(new PatternFill(new ForegroundColor { Rgb = headerArgb }) { PatternType = PatternValues.Solid })) { Count = 3 },
        new Borders(new Border(new LeftBorder(), new RightBorder(), new TopBorder(), new BottomBorder(), new DiagonalBorder())) { Count = 1 },
        new CellStyleFormats(new CellFormat { NumberFormatId = 0, FontId = 0, FillId = 0, BorderId = 0 }) { Count = 1 },
        new CellFormats(
            new CellFormat { NumberFormatId = 0, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0 },
            new CellFormat(new Alignment { WrapText = true, Vertical = VerticalAlignmentValues.Top }) { NumberFormatId = 0, FontId = 1, FillId = 2, BorderId = 0, FormatId = 0, ApplyFont = true, ApplyFill = true, ApplyAlignment = true },
            new CellFormat { NumberFormatId = 164, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 165, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 1, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0, ApplyNumberFormat = true },
            new CellFormat(new Alignment { WrapText = true, Vertical = VerticalAlignmentValues.Top }) { NumberFormatId = 0, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0, ApplyAlignment = true },
            new CellFormat { NumberFormatId = 49, FontId = 0, FillId = 0, BorderId = 0, FormatId = 0, ApplyNumberFormat = true, QuotePrefix = true }) { Count = 7 },
        new CellStyles(new CellStyle { Name = "Normal", FormatId = 0, BuiltinId = 0 }) { Count = 1 });
}
