/** The run is not in this laptop's store: not the user's, or never opened here while online. */
export function RunMissing({ online }: { online: boolean }) {
  return (
    <div className="notice-error">
      <p className="font-semibold">This run is not stored on this laptop.</p>
      <p>{online ? "It is not one of your runs." : "Connect to the network once with this run open, then it works offline."}</p>
      <a href="/cart" className="btn btn-secondary mt-2">
        Back to my work
      </a>
    </div>
  );
}
