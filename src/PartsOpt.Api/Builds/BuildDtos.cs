namespace PartsOpt.Api.Builds;

/// <summary>A build as a client asks for it: a stored design, how many boards, and the caller's reference.</summary>
/// <remarks>
/// <c>designId</c>: A stored design (GET /api/v1/designs/{id}).<br/>
/// <c>quantity</c>: Boards to build, 1 to 100000; every BOM line is reserved per board × quantity.<br/>
/// <c>reference</c>: The caller's work order or ticket, 1 to 100 printable characters.<br/>
/// <c>note</c>: Free text, at most 500 characters.<br/>
/// </remarks>
public sealed record BuildInput(int? DesignId, int? Quantity, string? Reference, string? Note);

/// <summary>A build with its lines.</summary>
/// <remarks>
/// <c>status</c>: "reserved", "completed" or "cancelled".<br/>
/// <c>actor</c>: The key that reserved the parts.<br/>
/// <c>closedBy</c>, <c>closedAt</c>: Who completed or cancelled the build, and when; absent while reserved.<br/>
/// </remarks>
public sealed record BuildDto(
    int Id,
    int DesignId,
    int Quantity,
    string Reference,
    string Note,
    string Status,
    string Actor,
    DateTime ReservedAt,
    string? ClosedBy,
    DateTime? ClosedAt,
    IReadOnlyList<BuildLineDto> Lines)
{
    public static BuildDto From(Build build) => new(
        build.Id, build.DesignId, build.Quantity, build.Reference, build.Note, BuildRules.StatusName(build.Status),
        build.Actor, build.ReservedAtUtc, build.ClosedBy, build.ClosedAtUtc,
        build.Lines.OrderBy(l => l.PartNumber, StringComparer.Ordinal)
            .Select(l => new BuildLineDto(l.PartNumber, l.PerUnit, l.Reserved, l.Consumed)).ToList());
}

/// <summary>One part of a build: per board, reserved for the whole build, and consumed on completion.</summary>
public sealed record BuildLineDto(string PartNumber, int PerUnit, int Reserved, int Consumed);

/// <summary>The data of build.reserved, build.completed and build.cancelled.</summary>
public sealed record BuildEventPayload(
    int BuildId, int DesignId, int Quantity, string Reference, string Status,
    IReadOnlyList<BuildEventPart> Parts, string Actor);

/// <summary>A part of a build event and how many moved: reserved, consumed or released.</summary>
public sealed record BuildEventPart(string PartNumber, int Quantity);
