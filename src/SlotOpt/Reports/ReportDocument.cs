using SlotOpt.Reports.Plots;

namespace SlotOpt.Reports;

/// <summary>The report as a sequence of blocks, written once and rendered twice (HTML and Markdown), so the two say the same thing.</summary>
public sealed record ReportDocument(string Title, IReadOnlyList<ReportBlock> Blocks);

/// <summary>One piece of a report. Text is plain: the renderers escape it.</summary>
public abstract record ReportBlock;

public sealed record Heading(string Text) : ReportBlock;

public sealed record Paragraph(string Text) : ReportBlock;

/// <summary>The one line that differs between two runs of the same problem: when it was generated and how long it took.</summary>
public sealed record StampLine(string Text) : ReportBlock;

/// <summary>The one-line verdict at the top of the first screen: the chosen design, what it saves, which limit binds.</summary>
public sealed record Verdict(string Text) : ReportBlock;

public sealed record BulletList(IReadOnlyList<string> Items) : ReportBlock;

/// <summary>A table; numeric columns are right-aligned.</summary>
public sealed record Table(IReadOnlyList<string> Header, IReadOnlyList<IReadOnlyList<string>> Rows, IReadOnlyList<bool> RightAligned) : ReportBlock;

public sealed record FigureBlock(Figure Figure) : ReportBlock;
